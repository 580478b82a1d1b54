CREATE TABLE `audit_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned,
	`actor_user_id` bigint unsigned,
	`action` varchar(64) NOT NULL,
	`target_type` varchar(32),
	`target_id` varchar(64),
	`detail` json,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `audit_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `balloon_families` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`compliance` enum('nc','sc') NOT NULL,
	`nominal_atm` decimal(4,1) NOT NULL,
	`rbp_atm` decimal(4,1) NOT NULL,
	`growth_at_rbp_mm` decimal(5,2),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `balloon_families_id` PRIMARY KEY(`id`),
	CONSTRAINT `balloon_families_lab_name_uq` UNIQUE(`lab_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `balloons` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`family_id` bigint unsigned NOT NULL,
	`diameter_mm` decimal(5,2) NOT NULL,
	`in_stock` boolean NOT NULL DEFAULT true,
	CONSTRAINT `balloons_id` PRIMARY KEY(`id`),
	CONSTRAINT `balloons_family_diameter_uq` UNIQUE(`family_id`,`diameter_mm`)
);
--> statement-breakpoint
CREATE TABLE `charts` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`title` varchar(160) NOT NULL,
	`definition` json NOT NULL,
	`logo_id` bigint unsigned,
	`live_fingerprint` char(64),
	`live_snapshot` json,
	`created_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3),
	CONSTRAINT `charts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `editions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`chart_id` bigint unsigned NOT NULL,
	`number` int NOT NULL,
	`status` enum('draft','approved','superseded','withdrawn') NOT NULL DEFAULT 'draft',
	`snapshot` json NOT NULL,
	`fingerprint` char(64) NOT NULL,
	`check_token` varchar(64) NOT NULL,
	`created_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`approved_by` bigint unsigned,
	`approved_by_name` varchar(120),
	`approved_at` datetime(3),
	`rejected_by` bigint unsigned,
	`rejected_at` datetime(3),
	`rejection_reason` text,
	`superseded_at` datetime(3),
	`withdrawn_by` bigint unsigned,
	`withdrawn_at` datetime(3),
	CONSTRAINT `editions_id` PRIMARY KEY(`id`),
	CONSTRAINT `editions_check_token_unique` UNIQUE(`check_token`),
	CONSTRAINT `editions_chart_number_uq` UNIQUE(`chart_id`,`number`)
);
--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`email` varchar(254) NOT NULL,
	`role` enum('manager','lead','educator','operator') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`invited_by` bigint unsigned,
	`expires_at` datetime(3) NOT NULL,
	`last_sent_at` datetime(3) NOT NULL,
	`accepted_at` datetime(3),
	`revoked_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `invitations_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitations_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `labs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`slug` varchar(64) NOT NULL,
	`name` varchar(160) NOT NULL,
	`stock_revision` int NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `labs_id` PRIMARY KEY(`id`),
	CONSTRAINT `labs_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `logos` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`sha256` char(64) NOT NULL,
	`mime` varchar(32) NOT NULL,
	`bytes` mediumblob NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `logos_id` PRIMARY KEY(`id`),
	CONSTRAINT `logos_lab_sha_uq` UNIQUE(`lab_id`,`sha256`)
);
--> statement-breakpoint
CREATE TABLE `memberships` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`role` enum('manager','lead','educator','operator') NOT NULL,
	`notify_stale` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `memberships_id` PRIMARY KEY(`id`),
	CONSTRAINT `memberships_lab_user_uq` UNIQUE(`lab_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`token_hash` char(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `password_resets_id` PRIMARY KEY(`id`),
	CONSTRAINT `password_resets_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `poster_renders` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`edition_id` bigint unsigned NOT NULL,
	`render_key` char(64) NOT NULL,
	`pdf` mediumblob NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `poster_renders_id` PRIMARY KEY(`id`),
	CONSTRAINT `poster_renders_render_key_unique` UNIQUE(`render_key`)
);
--> statement-breakpoint
CREATE TABLE `postings` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`edition_id` bigint unsigned NOT NULL,
	`room_id` bigint unsigned NOT NULL,
	`posted_by` bigint unsigned,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`removed_by` bigint unsigned,
	`removed_at` datetime(3),
	CONSTRAINT `postings_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rate_limits` (
	`key` varchar(255) NOT NULL,
	`points` int NOT NULL DEFAULT 0,
	`expire` bigint unsigned,
	CONSTRAINT `rate_limits_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
CREATE TABLE `rooms` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`archived_at` datetime(3),
	CONSTRAINT `rooms_id` PRIMARY KEY(`id`),
	CONSTRAINT `rooms_lab_name_uq` UNIQUE(`lab_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `stale_notices` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`change_key` varchar(128) NOT NULL,
	`detail` json,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`sent_at` datetime(3),
	CONSTRAINT `stale_notices_id` PRIMARY KEY(`id`),
	CONSTRAINT `stale_notices_lab_change_uq` UNIQUE(`lab_id`,`change_key`)
);
--> statement-breakpoint
CREATE TABLE `stent_platforms` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `stent_platforms_id` PRIMARY KEY(`id`),
	CONSTRAINT `stent_platforms_lab_name_uq` UNIQUE(`lab_id`,`name`)
);
--> statement-breakpoint
CREATE TABLE `stent_sizes` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`lab_id` bigint unsigned NOT NULL,
	`platform_id` bigint unsigned NOT NULL,
	`nominal_mm` decimal(5,2) NOT NULL,
	`max_post_dilatation_mm` decimal(5,2) NOT NULL,
	CONSTRAINT `stent_sizes_id` PRIMARY KEY(`id`),
	CONSTRAINT `stent_sizes_platform_nominal_uq` UNIQUE(`platform_id`,`nominal_mm`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(100) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_events` ADD CONSTRAINT `audit_events_actor_user_id_users_id_fk` FOREIGN KEY (`actor_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `balloon_families` ADD CONSTRAINT `balloon_families_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `balloons` ADD CONSTRAINT `balloons_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `balloons` ADD CONSTRAINT `balloons_family_id_balloon_families_id_fk` FOREIGN KEY (`family_id`) REFERENCES `balloon_families`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `charts` ADD CONSTRAINT `charts_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `charts` ADD CONSTRAINT `charts_logo_id_logos_id_fk` FOREIGN KEY (`logo_id`) REFERENCES `logos`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `charts` ADD CONSTRAINT `charts_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_chart_id_charts_id_fk` FOREIGN KEY (`chart_id`) REFERENCES `charts`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_approved_by_users_id_fk` FOREIGN KEY (`approved_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_rejected_by_users_id_fk` FOREIGN KEY (`rejected_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `editions` ADD CONSTRAINT `editions_withdrawn_by_users_id_fk` FOREIGN KEY (`withdrawn_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_invited_by_users_id_fk` FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `logos` ADD CONSTRAINT `logos_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `memberships` ADD CONSTRAINT `memberships_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `memberships` ADD CONSTRAINT `memberships_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `password_resets` ADD CONSTRAINT `password_resets_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `poster_renders` ADD CONSTRAINT `poster_renders_edition_id_editions_id_fk` FOREIGN KEY (`edition_id`) REFERENCES `editions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `postings` ADD CONSTRAINT `postings_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `postings` ADD CONSTRAINT `postings_edition_id_editions_id_fk` FOREIGN KEY (`edition_id`) REFERENCES `editions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `postings` ADD CONSTRAINT `postings_room_id_rooms_id_fk` FOREIGN KEY (`room_id`) REFERENCES `rooms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `postings` ADD CONSTRAINT `postings_posted_by_users_id_fk` FOREIGN KEY (`posted_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `postings` ADD CONSTRAINT `postings_removed_by_users_id_fk` FOREIGN KEY (`removed_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rooms` ADD CONSTRAINT `rooms_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stale_notices` ADD CONSTRAINT `stale_notices_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stent_platforms` ADD CONSTRAINT `stent_platforms_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stent_sizes` ADD CONSTRAINT `stent_sizes_lab_id_labs_id_fk` FOREIGN KEY (`lab_id`) REFERENCES `labs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stent_sizes` ADD CONSTRAINT `stent_sizes_platform_id_stent_platforms_id_fk` FOREIGN KEY (`platform_id`) REFERENCES `stent_platforms`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `audit_events_lab_idx` ON `audit_events` (`lab_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `audit_events_action_idx` ON `audit_events` (`action`);--> statement-breakpoint
CREATE INDEX `balloons_lab_idx` ON `balloons` (`lab_id`);--> statement-breakpoint
CREATE INDEX `charts_lab_idx` ON `charts` (`lab_id`);--> statement-breakpoint
CREATE INDEX `editions_lab_status_idx` ON `editions` (`lab_id`,`status`);--> statement-breakpoint
CREATE INDEX `invitations_lab_idx` ON `invitations` (`lab_id`,`email`);--> statement-breakpoint
CREATE INDEX `memberships_user_idx` ON `memberships` (`user_id`);--> statement-breakpoint
CREATE INDEX `password_resets_user_idx` ON `password_resets` (`user_id`);--> statement-breakpoint
CREATE INDEX `poster_renders_edition_idx` ON `poster_renders` (`edition_id`);--> statement-breakpoint
CREATE INDEX `postings_lab_idx` ON `postings` (`lab_id`,`removed_at`);--> statement-breakpoint
CREATE INDEX `postings_edition_idx` ON `postings` (`edition_id`);--> statement-breakpoint
CREATE INDEX `stent_sizes_lab_idx` ON `stent_sizes` (`lab_id`);