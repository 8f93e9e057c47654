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
-- Tables that arrived beside the review work (device combinations by row, lab data, evidence) freeze the same way.
--> statement-breakpoint
CREATE TRIGGER `simultaneous_group_members_frozen_insert` BEFORE INSERT ON `simultaneous_group_members` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `simultaneous_groups` WHERE `id` = NEW.`group_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: simultaneous_group_members rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `simultaneous_group_members_frozen_update` BEFORE UPDATE ON `simultaneous_group_members` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `simultaneous_groups` WHERE `id` = OLD.`group_id`)) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `simultaneous_groups` WHERE `id` = NEW.`group_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: simultaneous_group_members rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `simultaneous_group_members_frozen_delete` BEFORE DELETE ON `simultaneous_group_members` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = (SELECT `version_id` FROM `simultaneous_groups` WHERE `id` = OLD.`group_id`)) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: simultaneous_group_members rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_measurements_frozen_insert` BEFORE INSERT ON `lab_measurements` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_measurements rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_measurements_frozen_update` BEFORE UPDATE ON `lab_measurements` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_measurements rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_measurements_frozen_delete` BEFORE DELETE ON `lab_measurements` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_measurements rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_liquid_checks_frozen_insert` BEFORE INSERT ON `lab_liquid_checks` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_liquid_checks rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_liquid_checks_frozen_update` BEFORE UPDATE ON `lab_liquid_checks` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_liquid_checks rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_liquid_checks_frozen_delete` BEFORE DELETE ON `lab_liquid_checks` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_liquid_checks rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_system_checks_frozen_insert` BEFORE INSERT ON `lab_system_checks` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_system_checks rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_system_checks_frozen_update` BEFORE UPDATE ON `lab_system_checks` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_system_checks rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_system_checks_frozen_delete` BEFORE DELETE ON `lab_system_checks` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_system_checks rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_instruments_frozen_insert` BEFORE INSERT ON `lab_instruments` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_instruments rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_instruments_frozen_update` BEFORE UPDATE ON `lab_instruments` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_instruments rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_instruments_frozen_delete` BEFORE DELETE ON `lab_instruments` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_instruments rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_uncertainty_components_frozen_insert` BEFORE INSERT ON `lab_uncertainty_components` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_uncertainty_components rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_uncertainty_components_frozen_update` BEFORE UPDATE ON `lab_uncertainty_components` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_uncertainty_components rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `lab_uncertainty_components_frozen_delete` BEFORE DELETE ON `lab_uncertainty_components` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: lab_uncertainty_components rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `evidence_files_frozen_insert` BEFORE INSERT ON `evidence_files` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: evidence_files rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `evidence_files_frozen_update` BEFORE UPDATE ON `evidence_files` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: evidence_files rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `evidence_files_frozen_delete` BEFORE DELETE ON `evidence_files` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: evidence_files rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `evidence_explanations_frozen_insert` BEFORE INSERT ON `evidence_explanations` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: evidence_explanations rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `evidence_explanations_frozen_update` BEFORE UPDATE ON `evidence_explanations` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed' OR (SELECT `state` FROM `filing_versions` WHERE `id` = NEW.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: evidence_explanations rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `evidence_explanations_frozen_delete` BEFORE DELETE ON `evidence_explanations` WHEN (SELECT `state` FROM `filing_versions` WHERE `id` = OLD.`version_id`) = 'signed'
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: evidence_explanations rows cannot change');
END;
