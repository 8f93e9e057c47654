-- Combinations stored by transmitter key become members by transmitter row (same version).
INSERT OR IGNORE INTO `simultaneous_group_members` (`group_id`, `transmitter_id`, `sort_order`)
SELECT g.`id`, t.`id`, k.`key`
FROM `simultaneous_groups` g, json_each(g.`transmitter_keys`) k
JOIN `transmitters` t ON t.`version_id` = g.`version_id` AND t.`key` = k.`value`;
