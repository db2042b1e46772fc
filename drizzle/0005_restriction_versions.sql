ALTER TABLE `restrictions` ADD `version` int unsigned DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `restrictions` ADD `updated_at` timestamp(3) DEFAULT (now()) NOT NULL;