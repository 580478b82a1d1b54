CREATE TABLE `lab_rules` (
	`lab_id` bigint unsigned NOT NULL,
	`rules` json NOT NULL,
	`updated_by` bigint unsigned,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `lab_rules_lab_id` PRIMARY KEY(`lab_id`)
);
--> statement-breakpoint
ALTER TABLE `editions` MODIFY COLUMN `status` enum('draft','approved','superseded','withdrawn','returned') NOT NULL DEFAULT 'draft';--> statement-breakpoint
ALTER TABLE `editions` ADD `review_by` datetime(3);--> statement-breakpoint
ALTER TABLE `lab_rules` ADD CONSTRAINT `lab_rules_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `lab_rules` ADD CONSTRAINT `lab_rules_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;