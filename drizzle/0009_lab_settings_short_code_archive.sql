ALTER TABLE `charts` ADD `archived_at` datetime(3);--> statement-breakpoint
ALTER TABLE `labs` ADD `time_zone` varchar(64) DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE `labs` ADD `number_format` enum('point','comma') DEFAULT 'point' NOT NULL;--> statement-breakpoint
ALTER TABLE `labs` ADD `contact_line` varchar(200);--> statement-breakpoint
-- Every edition gets a typable short code (lib/editions/short-code.ts). Existing editions are
-- given one here: 8 symbols, each from 5 bits of RANDOM_BYTES (MariaDB's TLS library RNG), in
-- Crockford's Base32 alphabet. The guard trigger is dropped for the backfill and comes back
-- with the short code, once set, as immutable as the check token.
ALTER TABLE `editions` ADD `short_code` char(8) NULL;
--> statement-breakpoint
DROP TRIGGER IF EXISTS `editions_guard_update`;
--> statement-breakpoint
UPDATE `editions` SET `short_code` = CONCAT(SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1), SUBSTRING('0123456789ABCDEFGHJKMNPQRSTVWXYZ', (ORD(RANDOM_BYTES(1)) & 31) + 1, 1)) WHERE `short_code` IS NULL;
--> statement-breakpoint
ALTER TABLE `editions` MODIFY `short_code` char(8) NOT NULL;
--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_short_code_unique` UNIQUE(`short_code`);
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
