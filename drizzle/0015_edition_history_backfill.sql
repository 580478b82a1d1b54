-- Each approved edition records the edition it replaced (replaces_id), kept with its approval like
-- the approver and the review-by date; a withdrawn edition keeps its reason. Existing rows are
-- filled in with the guard off: the predecessor is the chart's edition approved last before this
-- one and not withdrawn by then; the reason comes from the withdrawal's audit row.
DROP TRIGGER IF EXISTS `editions_guard_update`;
--> statement-breakpoint
UPDATE `editions` e SET e.`replaces_id` = (
  SELECT p.`id` FROM `editions` p
  WHERE p.`chart_id` = e.`chart_id` AND p.`id` <> e.`id` AND p.`approved_at` IS NOT NULL
    AND p.`approved_at` < e.`approved_at` AND (p.`withdrawn_at` IS NULL OR p.`withdrawn_at` >= e.`approved_at`)
  ORDER BY p.`approved_at` DESC, p.`number` DESC LIMIT 1
) WHERE e.`approved_at` IS NOT NULL AND e.`replaces_id` IS NULL;
--> statement-breakpoint
UPDATE `editions` e SET e.`withdrawal_reason` = (
  SELECT JSON_UNQUOTE(JSON_EXTRACT(a.`detail`, '$.reason')) FROM `audit_events` a
  WHERE a.`action` = 'edition.withdrawn' AND a.`target_type` = 'edition' AND a.`target_id` = CAST(e.`id` AS CHAR)
  ORDER BY a.`id` DESC LIMIT 1
) WHERE e.`status` = 'withdrawn' AND e.`withdrawal_reason` IS NULL;
--> statement-breakpoint
CREATE TRIGGER `editions_guard_update` BEFORE UPDATE ON `editions` FOR EACH ROW
BEGIN
  IF NOT (NEW.`snapshot` <=> OLD.`snapshot`) OR NOT (NEW.`fingerprint` <=> OLD.`fingerprint`)
     OR NOT (NEW.`number` <=> OLD.`number`) OR NOT (NEW.`chart_id` <=> OLD.`chart_id`)
     OR NOT (NEW.`lab_id` <=> OLD.`lab_id`) OR NOT (NEW.`check_token` <=> OLD.`check_token`)
     OR (OLD.`short_code` IS NOT NULL AND NOT (NEW.`short_code` <=> OLD.`short_code`))
     OR NOT (NEW.`created_by` <=> OLD.`created_by`) OR NOT (NEW.`created_at` <=> OLD.`created_at`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'edition content is immutable';
  END IF;
  IF OLD.`status` <> 'draft' AND (NOT (NEW.`approved_by` <=> OLD.`approved_by`)
     OR NOT (NEW.`approved_by_name` <=> OLD.`approved_by_name`) OR NOT (NEW.`approved_at` <=> OLD.`approved_at`)
     OR NOT (NEW.`review_by` <=> OLD.`review_by`) OR NOT (NEW.`replaces_id` <=> OLD.`replaces_id`)) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'an approved edition keeps its approval';
  END IF;
  IF NOT (NEW.`status` = OLD.`status`
     OR (OLD.`status` = 'draft' AND NEW.`status` IN ('approved', 'returned', 'withdrawn'))
     OR (OLD.`status` = 'approved' AND NEW.`status` IN ('superseded', 'withdrawn'))
     OR (OLD.`status` = 'superseded' AND NEW.`status` = 'withdrawn')) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'edition status cannot move backwards';
  END IF;
  IF OLD.`status` <> 'draft' AND NEW.`status` = OLD.`status` THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'an approved edition can never change';
  END IF;
END;
