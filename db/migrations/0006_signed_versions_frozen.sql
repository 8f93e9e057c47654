-- Review states in our own words: the old "changes-requested" state is "returned".
UPDATE `filing_versions` SET `state` = 'returned' WHERE `state` = 'changes-requested';
--> statement-breakpoint
-- Each version names the device identity it was filed with (until now every version shared the filing's).
UPDATE `filing_versions` SET `device_id` = (SELECT `device_id` FROM `filings` WHERE `filings`.`id` = `filing_versions`.`filing_id`) WHERE `device_id` IS NULL;
--> statement-breakpoint
-- A signed version is frozen in the data layer: every row that belongs to it refuses UPDATE,
-- DELETE and INSERT, whatever writes it (the API, a script, the sqlite3 shell). The pattern for a
-- new table whose rows belong to a version is in DEVELOPERS.md ("Signed versions are frozen").
CREATE TRIGGER `antennas_frozen_insert` BEFORE INSERT ON `antennas` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: antennas rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `antennas_frozen_update` BEFORE UPDATE ON `antennas` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: antennas rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `antennas_frozen_delete` BEFORE DELETE ON `antennas` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: antennas rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `transmitters_frozen_insert` BEFORE INSERT ON `transmitters` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: transmitters rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `transmitters_frozen_update` BEFORE UPDATE ON `transmitters` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: transmitters rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `transmitters_frozen_delete` BEFORE DELETE ON `transmitters` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: transmitters rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_positions_frozen_insert` BEFORE INSERT ON `use_positions` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_positions rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_positions_frozen_update` BEFORE UPDATE ON `use_positions` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_positions rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_positions_frozen_delete` BEFORE DELETE ON `use_positions` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_positions rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `market_selections_frozen_insert` BEFORE INSERT ON `market_selections` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: market_selections rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `market_selections_frozen_update` BEFORE UPDATE ON `market_selections` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: market_selections rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `market_selections_frozen_delete` BEFORE DELETE ON `market_selections` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: market_selections rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `simultaneous_groups_frozen_insert` BEFORE INSERT ON `simultaneous_groups` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: simultaneous_groups rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `simultaneous_groups_frozen_update` BEFORE UPDATE ON `simultaneous_groups` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: simultaneous_groups rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `simultaneous_groups_frozen_delete` BEFORE DELETE ON `simultaneous_groups` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: simultaneous_groups rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `step_drafts_frozen_insert` BEFORE INSERT ON `step_drafts` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: step_drafts rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `step_drafts_frozen_update` BEFORE UPDATE ON `step_drafts` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: step_drafts rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `step_drafts_frozen_delete` BEFORE DELETE ON `step_drafts` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: step_drafts rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `screening_results_frozen_insert` BEFORE INSERT ON `screening_results` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: screening_results rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `screening_results_frozen_update` BEFORE UPDATE ON `screening_results` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: screening_results rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `screening_results_frozen_delete` BEFORE DELETE ON `screening_results` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: screening_results rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `version_editors_frozen_insert` BEFORE INSERT ON `version_editors` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: version_editors rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `version_editors_frozen_update` BEFORE UPDATE ON `version_editors` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: version_editors rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `version_editors_frozen_delete` BEFORE DELETE ON `version_editors` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: version_editors rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `review_threads_frozen_insert` BEFORE INSERT ON `review_threads` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: review_threads rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `review_threads_frozen_update` BEFORE UPDATE ON `review_threads` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: review_threads rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `review_threads_frozen_delete` BEFORE DELETE ON `review_threads` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: review_threads rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_position_separations_frozen_insert` BEFORE INSERT ON `use_position_separations` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = NEW.`use_position_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_position_separations rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_position_separations_frozen_update` BEFORE UPDATE ON `use_position_separations` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = OLD.`use_position_id`)) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = NEW.`use_position_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_position_separations rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `use_position_separations_frozen_delete` BEFORE DELETE ON `use_position_separations` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `use_positions` WHERE `id` = OLD.`use_position_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: use_position_separations rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `review_comments_frozen_insert` BEFORE INSERT ON `review_comments` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `review_threads` WHERE `id` = NEW.`thread_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: review_comments rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `review_comments_frozen_update` BEFORE UPDATE ON `review_comments` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `review_threads` WHERE `id` = OLD.`thread_id`)) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `review_threads` WHERE `id` = NEW.`thread_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: review_comments rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `review_comments_frozen_delete` BEFORE DELETE ON `review_comments` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `review_threads` WHERE `id` = OLD.`thread_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: review_comments rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `devices_frozen_update` BEFORE UPDATE ON `devices` WHEN EXISTS (SELECT 1 FROM `filing_versions` WHERE `device_id` = OLD.`id` AND `state` = 'signed')
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: devices rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `devices_frozen_delete` BEFORE DELETE ON `devices` WHEN EXISTS (SELECT 1 FROM `filing_versions` WHERE `device_id` = OLD.`id` AND `state` = 'signed')
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: devices rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `filing_versions_frozen_update` BEFORE UPDATE ON `filing_versions` WHEN OLD.`state` = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: filing_versions rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `filing_versions_frozen_delete` BEFORE DELETE ON `filing_versions` WHEN OLD.`state` = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: filing_versions rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `version_signatures_no_update` BEFORE UPDATE ON `version_signatures`
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: version_signatures rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `version_signatures_no_delete` BEFORE DELETE ON `version_signatures`
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: version_signatures rows cannot change');
END;
