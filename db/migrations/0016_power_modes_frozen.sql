-- A use position's power modes are frozen with its version once signed (the version is found
-- through the use position, see DEVELOPERS.md "Signed versions are frozen").
CREATE TRIGGER `use_position_power_modes_frozen_insert` BEFORE INSERT ON `use_position_power_modes` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = NEW.`use_position_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_position_power_modes rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_position_power_modes_frozen_update` BEFORE UPDATE ON `use_position_power_modes` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = OLD.`use_position_id`)) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = NEW.`use_position_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_position_power_modes rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_position_power_modes_frozen_delete` BEFORE DELETE ON `use_position_power_modes` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = OLD.`use_position_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_position_power_modes rows cannot change');
END;
