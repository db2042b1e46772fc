CREATE TABLE `rate_limit_hits` (
	`key_hash` char(64) NOT NULL,
	`hits` int unsigned NOT NULL DEFAULT 0,
	`reset_at` datetime(3) NOT NULL,
	CONSTRAINT `rate_limit_hits_key_hash` PRIMARY KEY(`key_hash`)
);
--> statement-breakpoint
CREATE INDEX `rate_limit_hits_reset_idx` ON `rate_limit_hits` (`reset_at`);