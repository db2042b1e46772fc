CREATE TABLE `attempt_jumps` (
	`athlete_id` bigint unsigned NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`jumps` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `attempt_jumps_athlete_id` PRIMARY KEY(`athlete_id`)
);
--> statement-breakpoint
CREATE TABLE `meet_attempts` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`meet_id` bigint unsigned NOT NULL,
	`entry_id` bigint unsigned NOT NULL,
	`lift` enum('squat','bench','deadlift') NOT NULL,
	`attempt_no` tinyint unsigned NOT NULL,
	`weight_kg` decimal(6,2) NOT NULL,
	`record` boolean NOT NULL DEFAULT false,
	`result` enum('good','missed') NOT NULL,
	`idempotency_key` varchar(64) NOT NULL,
	`marked_by` bigint unsigned,
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `meet_attempts_id` PRIMARY KEY(`id`),
	CONSTRAINT `meet_attempts_slot_uq` UNIQUE(`entry_id`,`lift`,`attempt_no`),
	CONSTRAINT `meet_attempts_key_uq` UNIQUE(`team_id`,`idempotency_key`)
);
--> statement-breakpoint
ALTER TABLE `meet_entries` ADD `weigh_in_kg` decimal(5,2);--> statement-breakpoint
ALTER TABLE `meet_entries` ADD `flight` varchar(2) DEFAULT 'A' NOT NULL;--> statement-breakpoint
ALTER TABLE `meet_entries` ADD `lot` smallint unsigned;--> statement-breakpoint
ALTER TABLE `meets` ADD `equipment` enum('classic','equipped') DEFAULT 'classic' NOT NULL;--> statement-breakpoint
ALTER TABLE `meets` ADD `results_saved_at` datetime(3);--> statement-breakpoint
ALTER TABLE `attempt_jumps` ADD CONSTRAINT `attempt_jumps_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `attempt_jumps` ADD CONSTRAINT `attempt_jumps_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_attempts` ADD CONSTRAINT `meet_attempts_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_attempts` ADD CONSTRAINT `meet_attempts_meet_id_meets_id_fk` FOREIGN KEY (`meet_id`) REFERENCES `meets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_attempts` ADD CONSTRAINT `meet_attempts_entry_id_meet_entries_id_fk` FOREIGN KEY (`entry_id`) REFERENCES `meet_entries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meet_attempts` ADD CONSTRAINT `meet_attempts_marked_by_users_id_fk` FOREIGN KEY (`marked_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `meet_attempts_meet_idx` ON `meet_attempts` (`meet_id`);