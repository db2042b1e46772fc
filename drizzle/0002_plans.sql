CREATE TABLE `plan_entries` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`slot_id` varchar(32) NOT NULL,
	`variant_id` bigint unsigned,
	`source` enum('engine','coach') NOT NULL,
	`pinned` boolean NOT NULL DEFAULT false,
	`reason` text,
	`reasons` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`updated_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `plan_entries_id` PRIMARY KEY(`id`),
	CONSTRAINT `plan_entries_cell_uq` UNIQUE(`athlete_id`,`week`,`slot_id`)
);
--> statement-breakpoint
CREATE TABLE `plan_entry_history` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`plan_entry_id` bigint unsigned NOT NULL,
	`athlete_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`slot_id` varchar(32) NOT NULL,
	`old_variant_id` bigint unsigned,
	`new_variant_id` bigint unsigned,
	`source` enum('engine','coach') NOT NULL,
	`pinned` boolean NOT NULL,
	`reason` text,
	`version` int unsigned NOT NULL,
	`changed_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `plan_entry_history_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `week_publications` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`week` char(8) NOT NULL,
	`published_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `week_publications_id` PRIMARY KEY(`id`),
	CONSTRAINT `week_publications_team_week_uq` UNIQUE(`team_id`,`week`)
);
--> statement-breakpoint
ALTER TABLE `plan_entries` ADD CONSTRAINT `plan_entries_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plan_entries` ADD CONSTRAINT `plan_entries_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plan_entries` ADD CONSTRAINT `plan_entries_variant_id_variants_id_fk` FOREIGN KEY (`variant_id`) REFERENCES `variants`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plan_entries` ADD CONSTRAINT `plan_entries_updated_by_users_id_fk` FOREIGN KEY (`updated_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plan_entry_history` ADD CONSTRAINT `plan_entry_history_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plan_entry_history` ADD CONSTRAINT `plan_entry_history_plan_entry_id_plan_entries_id_fk` FOREIGN KEY (`plan_entry_id`) REFERENCES `plan_entries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `plan_entry_history` ADD CONSTRAINT `plan_entry_history_changed_by_users_id_fk` FOREIGN KEY (`changed_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `week_publications` ADD CONSTRAINT `week_publications_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `week_publications` ADD CONSTRAINT `week_publications_published_by_users_id_fk` FOREIGN KEY (`published_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `plan_entries_team_week_idx` ON `plan_entries` (`team_id`,`week`);--> statement-breakpoint
CREATE INDEX `plan_entries_variant_idx` ON `plan_entries` (`variant_id`);--> statement-breakpoint
CREATE INDEX `plan_entry_history_entry_idx` ON `plan_entry_history` (`plan_entry_id`);