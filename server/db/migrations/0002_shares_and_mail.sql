CREATE TABLE `mail_messages` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`recipients` varchar(1000) NOT NULL,
	`subject` varchar(500) NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`raw` text NOT NULL,
	`received_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `mail_messages_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `one_time_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`purpose` enum('invite','reset') NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`expires_at` timestamp NOT NULL,
	`used_at` timestamp,
	CONSTRAINT `one_time_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `one_time_tokens_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `shares` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`capture_id` bigint unsigned,
	`comparison_id` bigint unsigned,
	`created_by` bigint unsigned,
	`email` varchar(254),
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`expires_at` timestamp NOT NULL,
	`revoked_at` timestamp,
	`last_opened_at` timestamp,
	`open_count` int NOT NULL DEFAULT 0,
	CONSTRAINT `shares_id` PRIMARY KEY(`id`),
	CONSTRAINT `shares_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
ALTER TABLE `one_time_tokens` ADD CONSTRAINT `one_time_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `shares` ADD CONSTRAINT `shares_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `shares` ADD CONSTRAINT `shares_comparison_id_comparisons_id_fk` FOREIGN KEY (`comparison_id`) REFERENCES `comparisons`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `shares` ADD CONSTRAINT `shares_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `shares_capture` ON `shares` (`capture_id`);--> statement-breakpoint
CREATE INDEX `shares_comparison` ON `shares` (`comparison_id`);