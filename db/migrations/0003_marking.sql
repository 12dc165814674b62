CREATE TABLE `mark_adjustments` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`sample_id` text NOT NULL,
	`slope` real NOT NULL,
	`intercept` real NOT NULL,
	`status` text DEFAULT 'proposed' NOT NULL,
	`decided_by_id` text,
	`decided_at` integer,
	`reason` text DEFAULT '' NOT NULL,
	`changes` text DEFAULT '[]' NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`sample_id`) REFERENCES `moderation_samples`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`decided_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE TABLE `marks` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`write_up_id` text NOT NULL,
	`marker_id` text,
	`criteria` text DEFAULT '{}' NOT NULL,
	`comments` text DEFAULT '{}' NOT NULL,
	`feedback` text DEFAULT '' NOT NULL,
	`total` integer DEFAULT 0 NOT NULL,
	`max_total` integer DEFAULT 0 NOT NULL,
	`adjusted_total` real,
	`adjustment_id` text,
	`revision` integer DEFAULT 0 NOT NULL,
	`marked_at` integer,
	`returned_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`write_up_id`) REFERENCES `write_ups`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`marker_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `marks_write_up` ON `marks` (`write_up_id`);--> statement-breakpoint
CREATE INDEX `marks_school_idx` ON `marks` (`school_id`);--> statement-breakpoint
CREATE TABLE `moderation_items` (
	`id` text PRIMARY KEY NOT NULL,
	`sample_id` text NOT NULL,
	`write_up_id` text NOT NULL,
	`origin` text DEFAULT 'drawn' NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`removed_at` integer,
	`removed_reason` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`sample_id`) REFERENCES `moderation_samples`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`write_up_id`) REFERENCES `write_ups`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `moderation_items_sample_write_up` ON `moderation_items` (`sample_id`,`write_up_id`);--> statement-breakpoint
CREATE TABLE `moderation_marks` (
	`id` text PRIMARY KEY NOT NULL,
	`sample_id` text NOT NULL,
	`write_up_id` text NOT NULL,
	`moderator_id` text NOT NULL,
	`criteria` text DEFAULT '{}' NOT NULL,
	`total` integer DEFAULT 0 NOT NULL,
	`comment` text DEFAULT '' NOT NULL,
	`revision` integer DEFAULT 0 NOT NULL,
	`completed_at` integer,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`sample_id`) REFERENCES `moderation_samples`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`write_up_id`) REFERENCES `write_ups`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`moderator_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `moderation_marks_sample_write_up` ON `moderation_marks` (`sample_id`,`write_up_id`);--> statement-breakpoint
CREATE TABLE `moderation_samples` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`lab_session_id` text,
	`practical_id` text,
	`moderator_id` text NOT NULL,
	`rule` text NOT NULL,
	`seed` integer NOT NULL,
	`blind` integer DEFAULT true NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`tolerance_marks` integer DEFAULT 1 NOT NULL,
	`drawn_by_id` text,
	`completed_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`lab_session_id`) REFERENCES `lab_sessions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`practical_id`) REFERENCES `practicals`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`moderator_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`drawn_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `moderation_samples_school_idx` ON `moderation_samples` (`school_id`);