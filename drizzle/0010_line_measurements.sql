ALTER TABLE `confirmed_redshifts` ADD `line_measurements` text;--> statement-breakpoint
ALTER TABLE `readings` ADD `line_measurements` text;