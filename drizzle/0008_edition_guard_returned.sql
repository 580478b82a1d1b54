-- The edition guard of 0001 again, with the `returned` state (a draft sent back with a reason,
-- never approvable) and the review-by date, which is set once at approval and then kept with it.
-- Allowed moves: draft -> approved | returned | withdrawn; approved -> superseded | withdrawn;
-- superseded -> withdrawn. The app enforces the same table in lib/editions/states.ts.
DROP TRIGGER IF EXISTS `editions_guard_update`;
--> statement-breakpoint
CREATE TRIGGER `editions_guard_update` BEFORE UPDATE ON `editions` FOR EACH ROW
BEGIN
  IF NOT (NEW.`snapshot` <=> OLD.`snapshot`) OR NOT (NEW.`fingerprint` <=> OLD.`fingerprint`)
     OR NOT (NEW.`number` <=> OLD.`number`) OR NOT (NEW.`chart_id` <=> OLD.`chart_id`)
     OR NOT (NEW.`lab_id` <=> OLD.`lab_id`) OR NOT (NEW.`check_token` <=> OLD.`check_token`)
     OR NOT (NEW.`created_by` <=> OLD.`created_by`) OR NOT (NEW.`created_at` <=> OLD.`created_at`) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'edition content is immutable';
  END IF;
  IF OLD.`status` <> 'draft' AND (NOT (NEW.`approved_by` <=> OLD.`approved_by`)
     OR NOT (NEW.`approved_by_name` <=> OLD.`approved_by_name`) OR NOT (NEW.`approved_at` <=> OLD.`approved_at`)
     OR NOT (NEW.`review_by` <=> OLD.`review_by`)) THEN
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
