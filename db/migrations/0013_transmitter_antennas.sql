CREATE TABLE `transmitter_antennas` (
	`transmitter_id` integer NOT NULL,
	`antenna_id` integer NOT NULL,
	`sort_order` integer NOT NULL,
	PRIMARY KEY(`transmitter_id`, `antenna_id`),
	FOREIGN KEY (`transmitter_id`) REFERENCES `transmitters`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`antenna_id`) REFERENCES `antennas`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
ALTER TABLE `transmitters` ADD `antenna_use` text DEFAULT 'mimo' NOT NULL;