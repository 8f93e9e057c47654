CREATE TABLE `antennas` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`gain_dbi` real NOT NULL,
	`location` text DEFAULT '' NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `antennas_version_key` ON `antennas` (`version_id`,`key`);--> statement-breakpoint
CREATE TABLE `devices` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`organisation_id` integer NOT NULL,
	`name` text NOT NULL,
	`model` text NOT NULL,
	`applicant` text NOT NULL,
	`product_type` text NOT NULL,
	`hardware_version` text DEFAULT '' NOT NULL,
	`firmware_version` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text,
	FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `devices_org` ON `devices` (`organisation_id`);--> statement-breakpoint
CREATE TABLE `filing_versions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`filing_id` integer NOT NULL,
	`number` integer NOT NULL,
	`state` text DEFAULT 'draft' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`filing_id`) REFERENCES `filings`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `filing_versions_filing_number` ON `filing_versions` (`filing_id`,`number`);--> statement-breakpoint
CREATE TABLE `filings` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`organisation_id` integer NOT NULL,
	`device_id` integer NOT NULL,
	`owner_user_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`device_id`) REFERENCES `devices`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`owner_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `filings_org_updated` ON `filings` (`organisation_id`,`updated_at`);--> statement-breakpoint
CREATE TABLE `market_selections` (
	`version_id` integer NOT NULL,
	`regime` text NOT NULL,
	`tier` text NOT NULL,
	`fcc_sar_screening` text,
	`sort_order` integer NOT NULL,
	PRIMARY KEY(`version_id`, `regime`),
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `screening_results` (
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
CREATE UNIQUE INDEX `screening_results_version_input` ON `screening_results` (`version_id`,`input_sha256`,`engine_version`,`rule_set_version`);--> statement-breakpoint
CREATE TABLE `simultaneous_groups` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`transmitter_keys` text NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `step_drafts` (
	`version_id` integer NOT NULL,
	`step` text NOT NULL,
	`data` text NOT NULL,
	`updated_at` text NOT NULL,
	PRIMARY KEY(`version_id`, `step`),
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `transmitters` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`technology` text NOT NULL,
	`band` text NOT NULL,
	`frequency_min_hz` real NOT NULL,
	`frequency_max_hz` real NOT NULL,
	`max_tune_up_power_dbm` real NOT NULL,
	`duty_cycle` real NOT NULL,
	`antenna_id` integer NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`antenna_id`) REFERENCES `antennas`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `transmitters_version_key` ON `transmitters` (`version_id`,`key`);--> statement-breakpoint
CREATE TABLE `use_position_separations` (
	`use_position_id` integer NOT NULL,
	`antenna_id` integer NOT NULL,
	`separation_m` real NOT NULL,
	PRIMARY KEY(`use_position_id`, `antenna_id`),
	FOREIGN KEY (`use_position_id`) REFERENCES `use_positions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`antenna_id`) REFERENCES `antennas`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `use_positions` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`key` text NOT NULL,
	`kind` text NOT NULL,
	`sort_order` integer NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `use_positions_version_key` ON `use_positions` (`version_id`,`key`);