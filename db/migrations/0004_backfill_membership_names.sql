-- Names and active state move from the shared account to each membership; existing members
-- with a password have accepted, pending invitations stay pending.
UPDATE `memberships` SET `name` = (SELECT `name` FROM `users` WHERE `users`.`id` = `memberships`.`user_id`);--> statement-breakpoint
UPDATE `memberships` SET `active` = (SELECT `active` FROM `users` WHERE `users`.`id` = `memberships`.`user_id`);--> statement-breakpoint
UPDATE `memberships` SET `accepted_at` = `created_at` WHERE (SELECT `password_hash` FROM `users` WHERE `users`.`id` = `memberships`.`user_id`) IS NOT NULL;
