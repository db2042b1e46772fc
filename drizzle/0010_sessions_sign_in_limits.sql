CREATE TABLE `sessions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`id_hash` char(64) NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`role` enum('head_coach','coach','athlete') NOT NULL,
	`user_agent` varchar(255),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`last_seen_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`),
	CONSTRAINT `sessions_id_hash_uq` UNIQUE(`id_hash`)
);
--> statement-breakpoint
CREATE TABLE `sign_in_limits` (
	`key_hash` char(64) NOT NULL,
	`failures` int unsigned NOT NULL DEFAULT 0,
	`last_failure_at` datetime(3) NOT NULL,
	`blocked_until` datetime(3),
	CONSTRAINT `sign_in_limits_key_hash` PRIMARY KEY(`key_hash`)
);
--> statement-breakpoint
ALTER TABLE `invitations` ADD `open_email` varchar(254) GENERATED ALWAYS AS ((case when `accepted_at` is null and `revoked_at` is null then `email` end)) STORED;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_team_open_email_uq` UNIQUE(`team_id`,`open_email`);--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `sessions_user_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE INDEX `sessions_expires_idx` ON `sessions` (`expires_at`);--> statement-breakpoint
CREATE INDEX `sign_in_limits_last_failure_idx` ON `sign_in_limits` (`last_failure_at`);