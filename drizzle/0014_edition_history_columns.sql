ALTER TABLE `editions` ADD `withdrawal_reason` text;--> statement-breakpoint
ALTER TABLE `editions` ADD `replaces_id` bigint unsigned;