CREATE TABLE `athletes` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned,
	`name` varchar(120) NOT NULL,
	`sex` enum('M','F') NOT NULL,
	`birth_year` smallint unsigned,
	`division` enum('open','junior','subjunior') NOT NULL DEFAULT 'open',
	`level` enum('novice','intermediate','advanced','elite') NOT NULL DEFAULT 'intermediate',
	`equipment` json NOT NULL,
	`rule_overrides` json NOT NULL,
	`notes` text,
	`archived_at` datetime(3),
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `athletes_id` PRIMARY KEY(`id`),
	CONSTRAINT `athletes_team_user_uq` UNIQUE(`team_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `meet_entries` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`meet_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`weight_class` varchar(8),
	`division` enum('open','junior','subjunior') NOT NULL DEFAULT 'open',
	`attempts` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `meet_entries_id` PRIMARY KEY(`id`),
	CONSTRAINT `meet_entries_meet_athlete_uq` UNIQUE(`meet_id`,`athlete_id`)
);
--> statement-breakpoint
CREATE TABLE `meets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`name` varchar(160) NOT NULL,
	`date` date NOT NULL,
	`location` varchar(160),
	`federation` varchar(120),
	`notes` text,
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `meets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `restrictions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`joint` enum('shoulder','elbow','wrist','lowerBack','hip','knee') NOT NULL,
	`max_stress` tinyint unsigned NOT NULL,
	`from_date` date NOT NULL,
	`to_date` date,
	`note` varchar(500),
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `restrictions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `team_rules` (
	`team_id` bigint unsigned NOT NULL,
	`rules` json NOT NULL,
	`equipment` json NOT NULL,
	`seed` varchar(64) NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`updated_by` bigint unsigned,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `team_rules_team_id` PRIMARY KEY(`team_id`)
);
--> statement-breakpoint
CREATE TABLE `variants` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`lift` enum('squat','bench','deadlift') NOT NULL,
	`family` varchar(60) NOT NULL,
	`bar` varchar(40) NOT NULL,
	`equipment` json NOT NULL,
	`emphasis` enum('bottom','midRange','lockout') NOT NULL,
	`stress` json NOT NULL,
	`risk` tinyint unsigned NOT NULL,
	`specificity` decimal(3,2) NOT NULL,
	`scheme` enum('single','triple','five') NOT NULL DEFAULT 'single',
	`notes` text,
	`archived_at` datetime(3),
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `variants_id` PRIMARY KEY(`id`),
	CONSTRAINT `variants_team_name_uq` UNIQUE(`team_id`,`name`)
);
--> statement-breakpoint
ALTER TABLE `athletes` ADD CONSTRAINT `athletes_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athletes` ADD CONSTRAINT `athletes_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_entries` ADD CONSTRAINT `meet_entries_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_entries` ADD CONSTRAINT `meet_entries_meet_id_meets_id_fk` FOREIGN KEY (`meet_id`) REFERENCES `meets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_entries` ADD CONSTRAINT `meet_entries_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meets` ADD CONSTRAINT `meets_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `restrictions` ADD CONSTRAINT `restrictions_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `restrictions` ADD CONSTRAINT `restrictions_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `restrictions` ADD CONSTRAINT `restrictions_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `team_rules` ADD CONSTRAINT `team_rules_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `team_rules` ADD CONSTRAINT `team_rules_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `variants` ADD CONSTRAINT `variants_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `athletes_team_idx` ON `athletes` (`team_id`);--> statement-breakpoint
CREATE INDEX `meet_entries_athlete_idx` ON `meet_entries` (`athlete_id`);--> statement-breakpoint
CREATE INDEX `meets_team_date_idx` ON `meets` (`team_id`,`date`);--> statement-breakpoint
CREATE INDEX `restrictions_athlete_idx` ON `restrictions` (`athlete_id`);--> statement-breakpoint
CREATE INDEX `variants_team_lift_idx` ON `variants` (`team_id`,`lift`);