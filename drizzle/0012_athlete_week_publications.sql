CREATE TABLE `athlete_week_publications` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`picks` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`published_by` bigint unsigned,
	`published_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `athlete_week_publications_id` PRIMARY KEY(`id`),
	CONSTRAINT `athlete_week_publications_athlete_week_uq` UNIQUE(`athlete_id`,`week`)
);
--> statement-breakpoint
ALTER TABLE `athlete_week_publications` ADD CONSTRAINT `athlete_week_publications_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_week_publications` ADD CONSTRAINT `athlete_week_publications_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_week_publications` ADD CONSTRAINT `athlete_week_publications_published_by_users_id_fk` FOREIGN KEY (`published_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;