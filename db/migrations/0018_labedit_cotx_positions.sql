ALTER TABLE `simultaneous_groups` ADD `use_position_id` integer REFERENCES use_positions(id) ON DELETE cascade;
