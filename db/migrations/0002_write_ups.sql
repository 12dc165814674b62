CREATE TABLE `check_attempts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`school_id` text NOT NULL,
	`write_up_id` text NOT NULL,
	`student_id` text NOT NULL,
	`check_id` text NOT NULL,
	`kind` text NOT NULL,
	`verdict` text NOT NULL,
	`slip_code` text,
	`at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`write_up_id`) REFERENCES `write_ups`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`student_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `check_attempts_student` ON `check_attempts` (`student_id`,`at`);--> statement-breakpoint
CREATE INDEX `check_attempts_write_up` ON `check_attempts` (`write_up_id`);--> statement-breakpoint
CREATE TABLE `group_tables` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`lab_session_id` text NOT NULL,
	`group_id` text NOT NULL,
	`tables` text NOT NULL,
	`revision` integer DEFAULT 0 NOT NULL,
	`updated_by_id` text,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`lab_session_id`) REFERENCES `lab_sessions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`updated_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `group_tables_session_group` ON `group_tables` (`lab_session_id`,`group_id`);--> statement-breakpoint
CREATE TABLE `write_ups` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`lab_session_id` text NOT NULL,
	`student_id` text NOT NULL,
	`practical_version_id` text NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`revision` integer DEFAULT 0 NOT NULL,
	`content` text NOT NULL,
	`check_results` text DEFAULT '{}' NOT NULL,
	`safety_acknowledged_at` integer,
	`submitted_at` integer,
	`late` integer DEFAULT false NOT NULL,
	`reopened_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`lab_session_id`) REFERENCES `lab_sessions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`student_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`practical_version_id`) REFERENCES `practical_versions`(`id`) ON UPDATE no action ON DELETE restrict
);
--> statement-breakpoint
CREATE UNIQUE INDEX `write_ups_session_student` ON `write_ups` (`lab_session_id`,`student_id`);--> statement-breakpoint
CREATE INDEX `write_ups_student_idx` ON `write_ups` (`student_id`);--> statement-breakpoint
CREATE INDEX `write_ups_school_idx` ON `write_ups` (`school_id`);