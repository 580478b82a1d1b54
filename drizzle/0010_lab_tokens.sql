CREATE TABLE `lab_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`name` varchar(80) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`hint` varchar(16) NOT NULL,
	`scopes` json NOT NULL,
	`created_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_used_at` datetime(3),
	`revoked_at` datetime(3),
	`revoked_by` bigint unsigned,
	CONSTRAINT `lab_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `lab_tokens_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
ALTER TABLE `audit_events` ADD `actor_token_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `lab_tokens` ADD CONSTRAINT `lab_tokens_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lab_tokens` ADD CONSTRAINT `lab_tokens_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lab_tokens` ADD CONSTRAINT `lab_tokens_revoked_by_users_id_fk` FOREIGN KEY (`revoked_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `lab_tokens_lab_idx` ON `lab_tokens` (`lab_id`);--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_actor_token_id_lab_tokens_id_fk` FOREIGN KEY (`actor_token_id`) REFERENCES `lab_tokens`(`id`) ON DELETE set null ON UPDATE no action;