CREATE TABLE `accessories` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`name` varchar(60) NOT NULL,
	`category` varchar(20) NOT NULL,
	`stress` json NOT NULL,
	`sets` tinyint unsigned NOT NULL,
	`reps` tinyint unsigned NOT NULL,
	`load_kg` decimal(5,1),
	`rpe` decimal(3,1),
	`notes` text,
	`archived_at` datetime(3),
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `accessories_id` PRIMARY KEY(`id`),
	CONSTRAINT `accessories_team_name_uq` UNIQUE(`team_id`,`name`)
);
--> statement-breakpoint
ALTER TABLE `accessories` ADD CONSTRAINT `accessories_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `accessories_team_category_idx` ON `accessories` (`team_id`,`category`);