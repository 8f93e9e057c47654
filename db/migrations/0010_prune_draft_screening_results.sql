-- Screening results are no longer stored when a screening is read: only the one a version is
-- signed on is kept (stored at signing). Results that earlier reads stored for versions that
-- are not signed are removed; a signed version's rows are frozen and stay as they are.
DELETE FROM `screening_results` WHERE `version_id` IN (SELECT `id` FROM `filing_versions` WHERE `state` <> 'signed');
