CREATE TABLE `device_modules` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`device_id` integer NOT NULL,
	`key` text NOT NULL,
	`name` text DEFAULT '' NOT NULL,
	`fcc_grantee_code` text DEFAULT '' NOT NULL,
	`fcc_product_code` text DEFAULT '' NOT NULL,
	`ised_company_number` text DEFAULT '' NOT NULL,
	`ised_upn` text DEFAULT '' NOT NULL,
	`min_separation_m` real,
	`conditions` text DEFAULT '' NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`device_id`) REFERENCES `devices`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `device_modules_device_key` ON `device_modules` (`device_id`,`key`);--> statement-breakpoint
ALTER TABLE `devices` ADD `fcc_grantee_code` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `fcc_product_code` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `ised_company_number` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `ised_upn` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `hvin` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `pmn` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `fvin` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `model_variants` text DEFAULT '[]' NOT NULL;--> statement-breakpoint
ALTER TABLE `devices` ADD `integration` text DEFAULT 'host' NOT NULL;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `tune_up_target_dbm` real;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `tune_up_tolerance_db` real;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `mode` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `modulation` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `bandwidth` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `duty_cycle_preset` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `transmitters` ADD `module_id` integer REFERENCES device_modules(id) ON DELETE set null;