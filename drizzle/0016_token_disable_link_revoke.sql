ALTER TABLE `email_verifications` ADD `revoked_at` datetime(3);--> statement-breakpoint
ALTER TABLE `lab_tokens` ADD `disabled_at` datetime(3);--> statement-breakpoint
ALTER TABLE `lab_tokens` ADD `disabled_reason` varchar(200);--> statement-breakpoint
CREATE INDEX `audit_events_target_idx` ON `audit_events` (`target_type`,`target_id`);