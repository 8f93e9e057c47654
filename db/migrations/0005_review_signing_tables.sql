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