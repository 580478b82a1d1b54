-- Before the database enforces one hanging copy per edition and room (next migration), repeats
-- recorded by concurrent requests are taken down, keeping the first posting of each pair.
UPDATE `postings` p
JOIN (
  SELECT `edition_id`, `room_id`, MIN(`id`) AS `keep_id`
  FROM `postings`
  WHERE `removed_at` IS NULL
  GROUP BY `edition_id`, `room_id`
  HAVING COUNT(*) > 1
) d ON d.`edition_id` = p.`edition_id` AND d.`room_id` = p.`room_id`
SET p.`removed_at` = NOW()
WHERE p.`removed_at` IS NULL AND p.`id` <> d.`keep_id`;
