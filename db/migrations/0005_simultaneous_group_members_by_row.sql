CREATE TABLE `simultaneous_group_members` (
	`group_id` integer NOT NULL,
	`transmitter_id` integer NOT NULL,
	`sort_order` integer NOT NULL,
	PRIMARY KEY(`group_id`, `transmitter_id`),
	FOREIGN KEY (`group_id`) REFERENCES `simultaneous_groups`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`transmitter_id`) REFERENCES `transmitters`(`id`) ON UPDATE no action ON DELETE cascade
);
