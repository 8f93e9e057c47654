CREATE TABLE `lab_import_mappings` (
	`organisation_id` integer NOT NULL,
	`header_sha256` text NOT NULL,
	`mapping` text NOT NULL,
	`updated_at` text NOT NULL,
	PRIMARY KEY(`organisation_id`, `header_sha256`),
	FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `lab_instruments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`kind` text NOT NULL,
	`model` text DEFAULT '' NOT NULL,
	`serial` text DEFAULT '' NOT NULL,
	`calibration_date` text NOT NULL,
	`due_date` text NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `lab_instruments_version_key` ON `lab_instruments` (`version_id`,`key`);--> statement-breakpoint
CREATE TABLE `lab_liquid_checks` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`date` text NOT NULL,
	`liquid` text NOT NULL,
	`frequency_hz` real NOT NULL,
	`relative_permittivity` real NOT NULL,
	`conductivity_s_per_m` real NOT NULL,
	`temperature_c` real,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `lab_liquid_checks_version_key` ON `lab_liquid_checks` (`version_id`,`key`);--> statement-breakpoint
CREATE TABLE `lab_measurements` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`transmitter_key` text NOT NULL,
	`use_position_key` text NOT NULL,
	`test_position` text DEFAULT '' NOT NULL,
	`channel` text DEFAULT '' NOT NULL,
	`frequency_hz` real NOT NULL,
	`test_separation_m` real NOT NULL,
	`measured_power_dbm` real NOT NULL,
	`tune_up_power_dbm` real,
	`test_duty_cycle` real DEFAULT 1 NOT NULL,
	`sar_1g_w_per_kg` real,
	`sar_10g_w_per_kg` real,
	`repeat_sar_w_per_kg` text NOT NULL,
	`drift_db` real,
	`test_date` text NOT NULL,
	`peak_x_mm` real,
	`peak_y_mm` real,
	`liquid_check_key` text,
	`system_check_key` text,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `lab_measurements_version_key` ON `lab_measurements` (`version_id`,`key`);--> statement-breakpoint
CREATE TABLE `lab_results` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`engine_version` text NOT NULL,
	`rule_set_version` text NOT NULL,
	`input_sha256` text NOT NULL,
	`input` text NOT NULL,
	`output` text NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `lab_results_version_input` ON `lab_results` (`version_id`,`input_sha256`,`engine_version`,`rule_set_version`);--> statement-breakpoint
CREATE TABLE `lab_system_checks` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`date` text NOT NULL,
	`frequency_hz` real NOT NULL,
	`dipole_serial` text DEFAULT '' NOT NULL,
	`averaging_mass` text NOT NULL,
	`measured_sar_w_per_kg_per_w` real NOT NULL,
	`target_sar_w_per_kg_per_w` real NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `lab_system_checks_version_key` ON `lab_system_checks` (`version_id`,`key`);--> statement-breakpoint
CREATE TABLE `lab_uncertainty_components` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`name` text NOT NULL,
	`value_pct` real NOT NULL,
	`distribution` text NOT NULL,
	`divisor` real,
	`sensitivity` real NOT NULL,
	`degrees_of_freedom` real,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `lab_uncertainty_components_version_name` ON `lab_uncertainty_components` (`version_id`,`name`);