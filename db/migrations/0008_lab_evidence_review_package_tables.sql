CREATE TABLE `document_texts` (
	`sha256` text PRIMARY KEY NOT NULL,
	`status` text NOT NULL,
	`reason` text,
	`page_count` integer DEFAULT 0 NOT NULL,
	`pages` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `evidence_explanations` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`evidence_id` integer NOT NULL,
	`finding_key` text NOT NULL,
	`reason` text NOT NULL,
	`user_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`evidence_id`) REFERENCES `evidence_files`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `evidence_explanations_key` ON `evidence_explanations` (`evidence_id`,`finding_key`);--> statement-breakpoint
CREATE TABLE `evidence_files` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`category` text NOT NULL,
	`title` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`file_name` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`media_type` text NOT NULL,
	`sha256` text NOT NULL,
	`document_date` text,
	`uploaded_by_user_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`replaces_id` integer,
	`replaced_by_id` integer,
	`carried_from_id` integer,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`uploaded_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`replaces_id`) REFERENCES `evidence_files`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`replaced_by_id`) REFERENCES `evidence_files`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`carried_from_id`) REFERENCES `evidence_files`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `evidence_files_version` ON `evidence_files` (`version_id`);--> statement-breakpoint
CREATE INDEX `evidence_files_sha256` ON `evidence_files` (`sha256`);--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`kind` text NOT NULL,
	`organisation_id` integer NOT NULL,
	`payload` text NOT NULL,
	`state` text DEFAULT 'queued' NOT NULL,
	`stage` text DEFAULT 'queued' NOT NULL,
	`percent` integer DEFAULT 0 NOT NULL,
	`result` text,
	`error` text,
	`requested_by_user_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`started_at` text,
	`finished_at` text,
	FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`requested_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `jobs_org_created` ON `jobs` (`organisation_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `jobs_state` ON `jobs` (`state`);--> statement-breakpoint
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
CREATE UNIQUE INDEX `lab_uncertainty_components_version_name` ON `lab_uncertainty_components` (`version_id`,`name`);--> statement-breakpoint
CREATE TABLE `packages` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`kind` text NOT NULL,
	`file_name` text NOT NULL,
	`storage_key` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`sha256` text NOT NULL,
	`manifest_sha256` text NOT NULL,
	`model_sha256` text NOT NULL,
	`job_id` integer,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `packages_version_kind` ON `packages` (`version_id`,`kind`);--> statement-breakpoint
CREATE INDEX `packages_sha256` ON `packages` (`sha256`);--> statement-breakpoint
CREATE INDEX `packages_manifest_sha256` ON `packages` (`manifest_sha256`);--> statement-breakpoint
CREATE TABLE `review_comments` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`thread_id` integer NOT NULL,
	`author_user_id` integer NOT NULL,
	`body` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	FOREIGN KEY (`thread_id`) REFERENCES `review_threads`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `review_comments_thread` ON `review_comments` (`thread_id`);--> statement-breakpoint
CREATE TABLE `review_threads` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`step` text NOT NULL,
	`row_ref` text,
	`state` text DEFAULT 'open' NOT NULL,
	`created_by_user_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	`resolved_by_user_id` integer,
	`resolved_at` text,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`resolved_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `review_threads_version` ON `review_threads` (`version_id`);--> statement-breakpoint
CREATE TABLE `version_editors` (
	`version_id` integer NOT NULL,
	`user_id` integer NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ', 'now')) NOT NULL,
	PRIMARY KEY(`version_id`, `user_id`),
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `version_signatures` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`version_id` integer NOT NULL,
	`signer_user_id` integer NOT NULL,
	`signer_name` text NOT NULL,
	`signer_role` text NOT NULL,
	`signed_at` text NOT NULL,
	`statement` text NOT NULL,
	`content_format` text NOT NULL,
	`content_sha256` text NOT NULL,
	`checklist` text NOT NULL,
	FOREIGN KEY (`version_id`) REFERENCES `filing_versions`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`signer_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `version_signatures_version` ON `version_signatures` (`version_id`);--> statement-breakpoint
ALTER TABLE `filing_versions` ADD `device_id` integer REFERENCES devices(id);