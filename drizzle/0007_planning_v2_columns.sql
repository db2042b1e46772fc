CREATE TABLE `rest_weeks` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` varchar(8) NOT NULL,
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `rest_weeks_id` PRIMARY KEY(`id`),
	CONSTRAINT `rest_weeks_athlete_week_uq` UNIQUE(`athlete_id`,`week`)
);
--> statement-breakpoint
ALTER TABLE `restrictions` MODIFY COLUMN `joint` enum('shoulder','elbow','wrist','lowerBack','hip','knee');--> statement-breakpoint
ALTER TABLE `restrictions` MODIFY COLUMN `max_stress` tinyint unsigned;--> statement-breakpoint
ALTER TABLE `athletes` ADD `max_risk` tinyint unsigned;--> statement-breakpoint
ALTER TABLE `restrictions` ADD `emphasis` json DEFAULT ('[]') NOT NULL;--> statement-breakpoint
ALTER TABLE `restrictions` ADD `families` json DEFAULT ('[]') NOT NULL;--> statement-breakpoint
ALTER TABLE `variants` ADD `meet_phase_weeks` tinyint unsigned;--> statement-breakpoint
ALTER TABLE `rest_weeks` ADD CONSTRAINT `rest_weeks_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rest_weeks` ADD CONSTRAINT `rest_weeks_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rest_weeks` ADD CONSTRAINT `rest_weeks_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `rest_weeks_team_idx` ON `rest_weeks` (`team_id`);