CREATE TABLE `job_items` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`job_id` integer NOT NULL,
	`file_name` text NOT NULL,
	`sha256` text,
	`spectrum_id` integer,
	`state` text DEFAULT 'pending' NOT NULL,
	`outcome` text,
	`error_code` text,
	`error_message` text,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`sha256`) REFERENCES `stored_files`(`sha256`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `job_items_job_state` ON `job_items` (`job_id`,`state`);--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`campaign_id` integer NOT NULL,
	`created_by` integer,
	`state` text DEFAULT 'queued' NOT NULL,
	`done` integer DEFAULT 0 NOT NULL,
	`total` integer DEFAULT 0 NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`lease_expires_at` text,
	`cancel_requested` integer DEFAULT false NOT NULL,
	`settings` text DEFAULT '{}' NOT NULL,
	`failure` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`started_at` text,
	`finished_at` text,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaigns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `jobs_state` ON `jobs` (`state`);--> statement-breakpoint
CREATE INDEX `jobs_campaign` ON `jobs` (`campaign_id`);--> statement-breakpoint
CREATE TABLE `scan_results` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`job_id` integer,
	`engine_version` text NOT NULL,
	`settings` text NOT NULL,
	`spectrum_class` text NOT NULL,
	`z_best` real,
	`z_best_err` real,
	`solutions` text NOT NULL,
	`line_matches` text NOT NULL,
	`meta` text NOT NULL,
	`curves` blob NOT NULL,
	`is_current` integer DEFAULT true NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`spectrum_id`) REFERENCES `spectra`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `scan_results_one_current` ON `scan_results` (`spectrum_id`) WHERE "scan_results"."is_current" = 1;--> statement-breakpoint
CREATE INDEX `scan_results_spectrum` ON `scan_results` (`spectrum_id`);--> statement-breakpoint
CREATE TABLE `spectra` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`campaign_id` integer NOT NULL,
	`sha256` text NOT NULL,
	`file_name` text NOT NULL,
	`target_id` integer,
	`link_method` text,
	`object_name` text,
	`ra` real,
	`dec` real,
	`instrument` text,
	`exposure_s` real,
	`date_obs` text,
	`medium` text NOT NULL,
	`pixels` integer NOT NULL,
	`wavelength_min` real NOT NULL,
	`wavelength_max` real NOT NULL,
	`snr_median` real,
	`errors_estimated` integer NOT NULL,
	`warnings` text DEFAULT '[]' NOT NULL,
	`upload_job_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaigns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`sha256`) REFERENCES `stored_files`(`sha256`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`target_id`) REFERENCES `targets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`upload_job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `spectra_campaign_sha256` ON `spectra` (`campaign_id`,`sha256`);--> statement-breakpoint
CREATE INDEX `spectra_target` ON `spectra` (`target_id`);--> statement-breakpoint
CREATE TABLE `stored_files` (
	`sha256` text PRIMARY KEY NOT NULL,
	`size_bytes` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `targets` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`campaign_id` integer NOT NULL,
	`catalogue_id` text NOT NULL,
	`ra` real,
	`dec` real,
	`magnitude` real,
	`photo_z` real,
	`photo_z_low` real,
	`photo_z_high` real,
	`image_family` text,
	`priority` integer,
	`extra` text DEFAULT '{}' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaigns`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `targets_campaign_catalogue_id` ON `targets` (`campaign_id`,`catalogue_id`);--> statement-breakpoint
CREATE INDEX `targets_family` ON `targets` (`campaign_id`,`image_family`);