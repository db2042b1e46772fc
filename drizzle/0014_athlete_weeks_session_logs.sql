CREATE TABLE `athlete_weeks` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`deload` boolean NOT NULL DEFAULT false,
	`training_max_pct` tinyint unsigned NOT NULL,
	`work` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`updated_by` bigint unsigned,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `athlete_weeks_id` PRIMARY KEY(`id`),
	CONSTRAINT `athlete_weeks_athlete_week_uq` UNIQUE(`athlete_id`,`week`)
);
--> statement-breakpoint
CREATE TABLE `session_logs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`session_id` varchar(32) NOT NULL,
	`speed_sets_done` tinyint unsigned NOT NULL DEFAULT 0,
	`accessory_sets_done` json NOT NULL,
	`done` boolean NOT NULL DEFAULT false,
	`version` int unsigned NOT NULL DEFAULT 1,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `session_logs_id` PRIMARY KEY(`id`),
	CONSTRAINT `session_logs_athlete_week_session_uq` UNIQUE(`athlete_id`,`week`,`session_id`)
);
--> statement-breakpoint
ALTER TABLE `athlete_weeks` ADD CONSTRAINT `athlete_weeks_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_weeks` ADD CONSTRAINT `athlete_weeks_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_weeks` ADD CONSTRAINT `athlete_weeks_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `session_logs` ADD CONSTRAINT `session_logs_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `session_logs` ADD CONSTRAINT `session_logs_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `athlete_weeks_team_week_idx` ON `athlete_weeks` (`team_id`,`week`);