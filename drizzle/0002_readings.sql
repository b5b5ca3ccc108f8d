CREATE TABLE `assignments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`reader_id` integer NOT NULL,
	`reading_order` text NOT NULL,
	`assigned_by` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`spectrum_id`) REFERENCES `spectra`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reader_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assigned_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `assignments_spectrum_reader` ON `assignments` (`spectrum_id`,`reader_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `assignments_spectrum_order` ON `assignments` (`spectrum_id`,`reading_order`);--> statement-breakpoint
CREATE INDEX `assignments_reader` ON `assignments` (`reader_id`);--> statement-breakpoint
CREATE TABLE `readings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`spectrum_id` integer NOT NULL,
	`reader_id` integer NOT NULL,
	`reading_order` text NOT NULL,
	`z` real NOT NULL,
	`z_err` real,
	`grade` integer NOT NULL,
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
CREATE UNIQUE INDEX `readings_spectrum_reader` ON `readings` (`spectrum_id`,`reader_id`);--> statement-breakpoint
CREATE INDEX `readings_reader` ON `readings` (`reader_id`);