-- Weeks published before publication was kept per athlete stay published: each athlete who had picks in such a
-- week is recorded as sent those picks, so upgrading never hides a week an athlete could already see.
INSERT INTO `athlete_week_publications` (`team_id`, `athlete_id`, `week`, `picks`, `published_by`, `published_at`)
SELECT wp.`team_id`, pe.`athlete_id`, wp.`week`,
  JSON_ARRAYAGG(JSON_OBJECT('slotId', pe.`slot_id`, 'variantId', pe.`variant_id`, 'variantName', v.`name`)),
  wp.`published_by`, wp.`created_at`
FROM `week_publications` wp
JOIN `plan_entries` pe ON pe.`team_id` = wp.`team_id` AND pe.`week` = wp.`week` AND pe.`variant_id` IS NOT NULL
JOIN `variants` v ON v.`id` = pe.`variant_id`
WHERE NOT EXISTS (
  SELECT 1 FROM `athlete_week_publications` awp WHERE awp.`athlete_id` = pe.`athlete_id` AND awp.`week` = wp.`week`
)
GROUP BY wp.`id`, pe.`athlete_id`;
