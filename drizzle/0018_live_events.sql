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
ALTER TABLE `live_events` ADD CONSTRAINT `live_events_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `live_events` ADD CONSTRAINT `live_events_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `live_events_created_idx` ON `live_events` (`created_at`);