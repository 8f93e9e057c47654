CREATE TABLE `use_position_power_modes` (
	`use_position_id` integer NOT NULL,
	`transmitter_id` integer NOT NULL,
	`reduced_tune_up_power_dbm` real NOT NULL,
	`trigger` text NOT NULL,
	`sort_order` integer NOT NULL,
	PRIMARY KEY(`use_position_id`, `transmitter_id`),
	FOREIGN KEY (`use_position_id`) REFERENCES `use_positions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`transmitter_id`) REFERENCES `transmitters`(`id`) ON UPDATE no action ON DELETE cascade
);
