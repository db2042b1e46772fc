CREATE TABLE `bodyweights` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`measured_on` date NOT NULL,
	`weight_kg` decimal(5,2) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `bodyweights_id` PRIMARY KEY(`id`),
	CONSTRAINT `bodyweights_athlete_day_uq` UNIQUE(`athlete_id`,`measured_on`)
);
--> statement-breakpoint
CREATE TABLE `tissue_checkins` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`kind` enum('highRep','isometric','loadedStretch') NOT NULL,
	`soreness` tinyint unsigned NOT NULL,
	`pain_joints` json NOT NULL,
	`note` varchar(500),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `tissue_checkins_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `tissue_prescriptions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`items` json NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `tissue_prescriptions_id` PRIMARY KEY(`id`),
	CONSTRAINT `tissue_prescriptions_athlete_week_uq` UNIQUE(`athlete_id`,`week`)
);
--> statement-breakpoint
CREATE TABLE `top_sets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`plan_entry_id` bigint unsigned,
	`variant_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`performed_on` date NOT NULL,
	`weight_kg` decimal(6,2) NOT NULL,
	`reps` tinyint unsigned NOT NULL,
	`rpe` decimal(3,1),
	`e1rm_kg` decimal(6,2) NOT NULL,
	`note` varchar(500),
	`video_id` bigint unsigned,
	`created_by` bigint unsigned,
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `top_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `video_comments` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`video_id` bigint unsigned NOT NULL,
	`author_id` bigint unsigned,
	`body` text NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `video_comments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `videos` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`storage_key` varchar(200) NOT NULL,
	`content_type` varchar(60) NOT NULL,
	`size_bytes` bigint unsigned NOT NULL,
	`original_name` varchar(255),
	`uploaded_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `videos_id` PRIMARY KEY(`id`),
	CONSTRAINT `videos_storage_key_uq` UNIQUE(`storage_key`)
);
--> statement-breakpoint
ALTER TABLE `bodyweights` ADD CONSTRAINT `bodyweights_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `bodyweights` ADD CONSTRAINT `bodyweights_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tissue_checkins` ADD CONSTRAINT `tissue_checkins_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tissue_checkins` ADD CONSTRAINT `tissue_checkins_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tissue_prescriptions` ADD CONSTRAINT `tissue_prescriptions_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tissue_prescriptions` ADD CONSTRAINT `tissue_prescriptions_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `top_sets` ADD CONSTRAINT `top_sets_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `top_sets` ADD CONSTRAINT `top_sets_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `top_sets` ADD CONSTRAINT `top_sets_plan_entry_id_plan_entries_id_fk` FOREIGN KEY (`plan_entry_id`) REFERENCES `plan_entries`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `top_sets` ADD CONSTRAINT `top_sets_variant_id_variants_id_fk` FOREIGN KEY (`variant_id`) REFERENCES `variants`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `top_sets` ADD CONSTRAINT `top_sets_video_id_videos_id_fk` FOREIGN KEY (`video_id`) REFERENCES `videos`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `top_sets` ADD CONSTRAINT `top_sets_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `video_comments` ADD CONSTRAINT `video_comments_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `video_comments` ADD CONSTRAINT `video_comments_video_id_videos_id_fk` FOREIGN KEY (`video_id`) REFERENCES `videos`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `video_comments` ADD CONSTRAINT `video_comments_author_id_users_id_fk` FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `videos` ADD CONSTRAINT `videos_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `videos` ADD CONSTRAINT `videos_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `videos` ADD CONSTRAINT `videos_uploaded_by_users_id_fk` FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `tissue_checkins_athlete_week_idx` ON `tissue_checkins` (`athlete_id`,`week`);--> statement-breakpoint
CREATE INDEX `top_sets_athlete_variant_idx` ON `top_sets` (`athlete_id`,`variant_id`);--> statement-breakpoint
CREATE INDEX `top_sets_entry_idx` ON `top_sets` (`plan_entry_id`);--> statement-breakpoint
CREATE INDEX `video_comments_video_idx` ON `video_comments` (`video_id`);--> statement-breakpoint
CREATE INDEX `videos_athlete_idx` ON `videos` (`athlete_id`);