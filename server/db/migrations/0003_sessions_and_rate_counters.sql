CREATE TABLE `rate_counters` (
	`counter_key` varchar(120) NOT NULL,
	`hits` int unsigned NOT NULL DEFAULT 0,
	`window_ends_at` timestamp(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`next_allowed_at` timestamp(3),
	CONSTRAINT `rate_counters_counter_key` PRIMARY KEY(`counter_key`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`id_hash` varchar(64) NOT NULL,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`last_seen_at` timestamp NOT NULL DEFAULT (now()),
	`expires_at` timestamp NOT NULL,
	`revoked_at` timestamp,
	`user_agent` varchar(120) NOT NULL DEFAULT '',
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`),
	CONSTRAINT `sessions_id_hash_unique` UNIQUE(`id_hash`)
);
--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `sessions_user` ON `sessions` (`user_id`);