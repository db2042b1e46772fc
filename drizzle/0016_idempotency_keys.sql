CREATE TABLE `idempotency_keys` (
	`user_id` bigint unsigned NOT NULL,
	`idem_key` char(36) NOT NULL,
	`route` varchar(255) NOT NULL,
	`fingerprint` char(64) NOT NULL,
	`status` smallint unsigned,
	`response` mediumtext,
	`claimed_at` datetime(3) NOT NULL DEFAULT UTC_TIMESTAMP(3),
	`created_at` datetime(3) NOT NULL DEFAULT UTC_TIMESTAMP(3),
	CONSTRAINT `idempotency_keys_user_id_idem_key_pk` PRIMARY KEY(`user_id`,`idem_key`)
);
--> statement-breakpoint
ALTER TABLE `idempotency_keys` ADD CONSTRAINT `idempotency_keys_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `idempotency_keys_created_idx` ON `idempotency_keys` (`created_at`);