ALTER TABLE `mail_messages` ADD `organisation_id` integer REFERENCES organisations(id);--> statement-breakpoint
CREATE INDEX `mail_messages_org` ON `mail_messages` (`organisation_id`,`id`);--> statement-breakpoint
ALTER TABLE `memberships` ADD `name` text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE `memberships` ADD `active` integer DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE `memberships` ADD `accepted_at` text;--> statement-breakpoint
ALTER TABLE `password_tokens` ADD `organisation_id` integer REFERENCES organisations(id);