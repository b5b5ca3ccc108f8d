CREATE TABLE `confirmed_redshifts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`z` real NOT NULL,
	`z_err` real,
	`grade` integer NOT NULL,
	`spectrum_class` text NOT NULL,
	`lines` text NOT NULL,
	`method` text NOT NULL,
	`first_reading_id` integer,
	`second_reading_id` integer,
	`decided_by` integer,
	`reason` text,
	`supersedes_id` integer,
	`is_current` integer DEFAULT true NOT NULL,
	`superseded_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`spectrum_id`) REFERENCES `spectra`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`first_reading_id`) REFERENCES `readings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`second_reading_id`) REFERENCES `readings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `confirmed_one_current` ON `confirmed_redshifts` (`spectrum_id`) WHERE "confirmed_redshifts"."is_current" = 1;--> statement-breakpoint
CREATE INDEX `confirmed_spectrum` ON `confirmed_redshifts` (`spectrum_id`);--> statement-breakpoint
CREATE TABLE `disagreements` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`campaign_id` integer NOT NULL,
	`first_reading_id` integer NOT NULL,
	`second_reading_id` integer NOT NULL,
	`reasons` text NOT NULL,
	`state` text DEFAULT 'open' NOT NULL,
	`confirmed_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`closed_at` text,
	FOREIGN KEY (`spectrum_id`) REFERENCES `spectra`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaigns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`first_reading_id`) REFERENCES `readings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`second_reading_id`) REFERENCES `readings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`confirmed_id`) REFERENCES `confirmed_redshifts`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `disagreements_one_open` ON `disagreements` (`spectrum_id`) WHERE "disagreements"."state" = 'open';--> statement-breakpoint
CREATE INDEX `disagreements_campaign` ON `disagreements` (`campaign_id`,`state`);