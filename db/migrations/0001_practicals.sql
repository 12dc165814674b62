CREATE TABLE `lab_sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`class_id` text NOT NULL,
	`practical_id` text NOT NULL,
	`practical_version_id` text NOT NULL,
	`opens_at` integer NOT NULL,
	`due_at` integer NOT NULL,
	`grouping` text DEFAULT 'individual' NOT NULL,
	`groups` text DEFAULT '[]' NOT NULL,
	`late_work` text DEFAULT 'accept-flagged' NOT NULL,
	`late_days` integer DEFAULT 7 NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`cancelled_at` integer,
	`created_by_id` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`class_id`) REFERENCES `classes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`practical_id`) REFERENCES `practicals`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`practical_version_id`) REFERENCES `practical_versions`(`id`) ON UPDATE no action ON DELETE restrict,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `lab_sessions_class_idx` ON `lab_sessions` (`class_id`,`opens_at`);--> statement-breakpoint
CREATE INDEX `lab_sessions_school_idx` ON `lab_sessions` (`school_id`);--> statement-breakpoint
CREATE INDEX `lab_sessions_version_idx` ON `lab_sessions` (`practical_version_id`);--> statement-breakpoint
CREATE TABLE `practical_versions` (
	`id` text PRIMARY KEY NOT NULL,
	`practical_id` text NOT NULL,
	`school_id` text NOT NULL,
	`version` integer NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`title` text NOT NULL,
	`topic` text NOT NULL,
	`subject` text DEFAULT 'Chemistry' NOT NULL,
	`year_group` integer NOT NULL,
	`content` text NOT NULL,
	`revision` integer DEFAULT 0 NOT NULL,
	`created_by_id` text,
	`published_at` integer,
	`published_by_id` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`practical_id`) REFERENCES `practicals`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`published_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `practical_versions_number` ON `practical_versions` (`practical_id`,`version`);--> statement-breakpoint
CREATE INDEX `practical_versions_school_idx` ON `practical_versions` (`school_id`);--> statement-breakpoint
CREATE TABLE `practicals` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`title` text NOT NULL,
	`topic` text NOT NULL,
	`subject` text DEFAULT 'Chemistry' NOT NULL,
	`year_group` integer NOT NULL,
	`archived` integer DEFAULT false NOT NULL,
	`created_by_id` text,
	`copied_from_id` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `practicals_school_idx` ON `practicals` (`school_id`,`archived`);--> statement-breakpoint
CREATE TABLE `rubrics` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`title` text NOT NULL,
	`body` text NOT NULL,
	`revision` integer DEFAULT 0 NOT NULL,
	`archived` integer DEFAULT false NOT NULL,
	`created_by_id` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `rubrics_school_idx` ON `rubrics` (`school_id`);