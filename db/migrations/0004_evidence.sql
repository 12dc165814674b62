CREATE TABLE `evidence` (
	`id` text PRIMARY KEY NOT NULL,
	`school_id` text NOT NULL,
	`write_up_id` text,
	`practical_id` text,
	`uploaded_by_id` text,
	`caption` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`upload_key` text NOT NULL,
	`image_key` text,
	`thumb_key` text,
	`declared_type` text NOT NULL,
	`declared_size` integer NOT NULL,
	`original_name` text DEFAULT '' NOT NULL,
	`size` integer,
	`width` integer,
	`height` integer,
	`sha256` text,
	`reject_reason` text,
	`confirmed_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`school_id`) REFERENCES `schools`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`write_up_id`) REFERENCES `write_ups`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`practical_id`) REFERENCES `practicals`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `evidence_write_up_idx` ON `evidence` (`write_up_id`);--> statement-breakpoint
CREATE INDEX `evidence_practical_idx` ON `evidence` (`practical_id`);--> statement-breakpoint
CREATE INDEX `evidence_status_idx` ON `evidence` (`status`,`created_at`);