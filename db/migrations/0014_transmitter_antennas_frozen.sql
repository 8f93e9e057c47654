-- A transmitter's further antennas are frozen with its version once signed (the version is found
-- through the transmitter, see DEVELOPERS.md "Signed versions are frozen").
CREATE TRIGGER `transmitter_antennas_frozen_insert` BEFORE INSERT ON `transmitter_antennas` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `transmitters` WHERE `id` = NEW.`transmitter_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: transmitter_antennas rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `transmitter_antennas_frozen_update` BEFORE UPDATE ON `transmitter_antennas` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `transmitters` WHERE `id` = OLD.`transmitter_id`)) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `transmitters` WHERE `id` = NEW.`transmitter_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: transmitter_antennas rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `transmitter_antennas_frozen_delete` BEFORE DELETE ON `transmitter_antennas` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `transmitters` WHERE `id` = OLD.`transmitter_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: transmitter_antennas rows cannot change');
END;
