CREATE TABLE `live_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned,
	`topic` enum('plan','messages','notices') NOT NULL,
	`weeks` varchar(200) NOT NULL DEFAULT '',
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `live_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `message_reads` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`last_read_id` bigint unsigned NOT NULL,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `message_reads_id` PRIMARY KEY(`id`),
	CONSTRAINT `message_reads_reader_thread_uq` UNIQUE(`user_id`,`athlete_id`,`week`)
);
--> statement-breakpoint
CREATE TABLE `messages` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`author_id` bigint unsigned,
	`author_role` enum('athlete','coach') NOT NULL,
	`body` text NOT NULL,
	`link_week` char(8),
	`link_slot_id` varchar(32),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `messages_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `notice_settings` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`daily_email` boolean NOT NULL DEFAULT true,
	`last_digest_on` date,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `notice_settings_id` PRIMARY KEY(`id`),
	CONSTRAINT `notice_settings_user_uq` UNIQUE(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `notices` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`kind` enum('pain','top_set_low','top_set_missed','video','message') NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`text` varchar(300) NOT NULL,
	`path` varchar(200) NOT NULL,
	`dedupe_key` varchar(120) NOT NULL,
	`read_at` datetime(3),
	`digested_at` datetime(3),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `notices_id` PRIMARY KEY(`id`),
	CONSTRAINT `notices_user_dedupe_uq` UNIQUE(`user_id`,`dedupe_key`)
);
--> statement-breakpoint
ALTER TABLE `live_events` ADD CONSTRAINT `live_events_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_events` ADD CONSTRAINT `live_events_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `message_reads` ADD CONSTRAINT `message_reads_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `message_reads` ADD CONSTRAINT `message_reads_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `message_reads` ADD CONSTRAINT `message_reads_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `messages` ADD CONSTRAINT `messages_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `messages` ADD CONSTRAINT `messages_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `messages` ADD CONSTRAINT `messages_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notice_settings` ADD CONSTRAINT `notice_settings_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notices` ADD CONSTRAINT `notices_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notices` ADD CONSTRAINT `notices_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notices` ADD CONSTRAINT `notices_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `live_events_created_idx` ON `live_events` (`created_at`);--> statement-breakpoint
CREATE INDEX `messages_thread_idx` ON `messages` (`team_id`,`athlete_id`,`week`,`id`);--> statement-breakpoint
CREATE INDEX `notices_user_idx` ON `notices` (`user_id`,`read_at`,`id`);