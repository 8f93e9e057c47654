ALTER TABLE `filings` ADD `archived_at` text;--> statement-breakpoint
ALTER TABLE `filings` ADD `archived_by_user_id` integer REFERENCES users(id);--> statement-breakpoint
ALTER TABLE `filings` ADD `import_sha256` text;--> statement-breakpoint
CREATE INDEX `filings_org_import` ON `filings` (`organisation_id`,`import_sha256`);