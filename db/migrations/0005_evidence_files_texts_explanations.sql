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
CREATE INDEX `evidence_files_sha256` ON `evidence_files` (`sha256`);