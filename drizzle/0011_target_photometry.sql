CREATE TABLE `campaign_filters` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`campaign_id` integer NOT NULL,
	`name` text NOT NULL,
	`curve_text` text NOT NULL,
	`created_by` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaigns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `campaign_filters_name` ON `campaign_filters` (`campaign_id`,`name`);--> statement-breakpoint
CREATE TABLE `catalogue_mappings` (
	`campaign_id` integer PRIMARY KEY NOT NULL,
	`mapping` text NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`campaign_id`) REFERENCES `campaigns`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `photo_z_fits` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`target_id` integer NOT NULL,
	`z` real NOT NULL,
	`z68_low` real NOT NULL,
	`z68_high` real NOT NULL,
	`z95_low` real NOT NULL,
	`z95_high` real NOT NULL,
	`p_low_z` real NOT NULL,
	`fit_class` text NOT NULL,
	`star_chi2` real NOT NULL,
	`galaxy_chi2` real NOT NULL,
	`galaxy_template` text NOT NULL,
	`star_template` text,
	`filters` text NOT NULL,
	`template_set` text NOT NULL,
	`grid_z_max` real NOT NULL,
	`grid_step` real NOT NULL,
	`posterior` blob NOT NULL,
	`computed_at` text NOT NULL,
	FOREIGN KEY (`target_id`) REFERENCES `targets`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `photo_z_fits_target` ON `photo_z_fits` (`target_id`);--> statement-breakpoint
CREATE TABLE `target_photometry` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`target_id` integer NOT NULL,
	`filter` text NOT NULL,
	`flux_njy` real NOT NULL,
	`err_njy` real NOT NULL,
	`given_value` real NOT NULL,
	`given_error` real NOT NULL,
	`unit` text NOT NULL,
	FOREIGN KEY (`target_id`) REFERENCES `targets`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `target_photometry_band` ON `target_photometry` (`target_id`,`filter`);