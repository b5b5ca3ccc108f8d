PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_confirmed_redshifts` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`z` real NOT NULL,
	`z_err` real,
	`grade` text NOT NULL,
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
INSERT INTO `__new_confirmed_redshifts`("id", "spectrum_id", "z", "z_err", "grade", "spectrum_class", "lines", "method", "first_reading_id", "second_reading_id", "decided_by", "reason", "supersedes_id", "is_current", "superseded_at", "created_at") SELECT "id", "spectrum_id", "z", "z_err", "grade", "spectrum_class", "lines", "method", "first_reading_id", "second_reading_id", "decided_by", "reason", "supersedes_id", "is_current", "superseded_at", "created_at" FROM `confirmed_redshifts`;--> statement-breakpoint
DROP TABLE `confirmed_redshifts`;--> statement-breakpoint
ALTER TABLE `__new_confirmed_redshifts` RENAME TO `confirmed_redshifts`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE UNIQUE INDEX `confirmed_one_current` ON `confirmed_redshifts` (`spectrum_id`) WHERE "confirmed_redshifts"."is_current" = 1;--> statement-breakpoint
CREATE INDEX `confirmed_spectrum` ON `confirmed_redshifts` (`spectrum_id`);--> statement-breakpoint
CREATE TABLE `__new_readings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`reader_id` integer NOT NULL,
	`reading_order` text NOT NULL,
	`z` real NOT NULL,
	`z_err` real,
	`grade` text NOT NULL,
	`spectrum_class` text NOT NULL,
	`lines` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`time_spent_ms` integer DEFAULT 0 NOT NULL,
	`revision` integer DEFAULT 1 NOT NULL,
	`locked_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`spectrum_id`) REFERENCES `spectra`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reader_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
INSERT INTO `__new_readings`("id", "spectrum_id", "reader_id", "reading_order", "z", "z_err", "grade", "spectrum_class", "lines", "note", "time_spent_ms", "revision", "locked_at", "created_at", "updated_at") SELECT "id", "spectrum_id", "reader_id", "reading_order", "z", "z_err", "grade", "spectrum_class", "lines", "note", "time_spent_ms", "revision", "locked_at", "created_at", "updated_at" FROM `readings`;--> statement-breakpoint
DROP TABLE `readings`;--> statement-breakpoint
ALTER TABLE `__new_readings` RENAME TO `readings`;--> statement-breakpoint
CREATE UNIQUE INDEX `readings_spectrum_reader` ON `readings` (`spectrum_id`,`reader_id`);--> statement-breakpoint
CREATE INDEX `readings_reader` ON `readings` (`reader_id`);