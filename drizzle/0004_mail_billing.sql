CREATE TABLE `outbox` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned,
	`kind` varchar(40) NOT NULL,
	`dedupe_key` varchar(191) NOT NULL,
	`to_email` varchar(254) NOT NULL,
	`subject` varchar(200) NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text NOT NULL,
	`attempts` int unsigned NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL,
	`sent_at` datetime(3),
	`last_error` varchar(500),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`),
	CONSTRAINT `outbox_dedupe_uq` UNIQUE(`dedupe_key`)
);
--> statement-breakpoint
CREATE TABLE `athlete_billing` (
	`athlete_id` bigint unsigned NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`fee_plan_id` bigint unsigned,
	`provider_customer_id` varchar(120),
	`provider_subscription_id` varchar(120),
	`status` enum('none','pending','active','past_due','cancelled') NOT NULL DEFAULT 'none',
	`current_period_end` datetime(3),
	`last_payment_at` datetime(3),
	`version` int unsigned NOT NULL DEFAULT 1,
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `athlete_billing_athlete_id` PRIMARY KEY(`athlete_id`)
);
--> statement-breakpoint
CREATE TABLE `fee_plans` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`team_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`price_minor` int unsigned NOT NULL,
	`currency` char(3) NOT NULL,
	`description` text,
	`provider_product_id` varchar(120),
	`provider_price_id` varchar(120),
	`archived_at` datetime(3),
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `fee_plans_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `payment_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`event_id` varchar(120) NOT NULL,
	`type` varchar(80) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `payment_events_id` PRIMARY KEY(`id`),
	CONSTRAINT `payment_events_event_uq` UNIQUE(`event_id`)
);
--> statement-breakpoint
ALTER TABLE `outbox` ADD CONSTRAINT `outbox_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_billing` ADD CONSTRAINT `athlete_billing_athlete_id_athletes_id_fk` FOREIGN KEY (`athlete_id`) REFERENCES `athletes`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_billing` ADD CONSTRAINT `athlete_billing_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `athlete_billing` ADD CONSTRAINT `athlete_billing_fee_plan_id_fee_plans_id_fk` FOREIGN KEY (`fee_plan_id`) REFERENCES `fee_plans`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fee_plans` ADD CONSTRAINT `fee_plans_team_id_teams_id_fk` FOREIGN KEY (`team_id`) REFERENCES `teams`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `outbox_due_idx` ON `outbox` (`sent_at`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `athlete_billing_team_idx` ON `athlete_billing` (`team_id`);--> statement-breakpoint
CREATE INDEX `athlete_billing_customer_idx` ON `athlete_billing` (`provider_customer_id`);--> statement-breakpoint
CREATE INDEX `fee_plans_team_idx` ON `fee_plans` (`team_id`);