-- A device's module grants are frozen with the device once a version that names the device is
-- signed (the device row itself is, see 0009).
CREATE TRIGGER `device_modules_frozen_insert` BEFORE INSERT ON `device_modules` WHEN EXISTS (SELECT 1 FROM `filing_versions` WHERE `device_id` = NEW.`device_id` AND `state` = 'signed')
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: device_modules rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `device_modules_frozen_update` BEFORE UPDATE ON `device_modules` WHEN EXISTS (SELECT 1 FROM `filing_versions` WHERE `device_id` = OLD.`device_id` AND `state` = 'signed') OR EXISTS (SELECT 1 FROM `filing_versions` WHERE `device_id` = NEW.`device_id` AND `state` = 'signed')
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: device_modules rows cannot change');
END;
--> statement-breakpoint
CREATE TRIGGER `device_modules_frozen_delete` BEFORE DELETE ON `device_modules` WHEN EXISTS (SELECT 1 FROM `filing_versions` WHERE `device_id` = OLD.`device_id` AND `state` = 'signed')
BEGIN
  SELECT RAISE(ABORT, 'signed version is frozen: device_modules rows cannot change');
END;
