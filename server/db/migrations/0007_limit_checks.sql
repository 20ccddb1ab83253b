CREATE TABLE `limit_checks` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`capture_id` bigint unsigned NOT NULL,
	`request` json NOT NULL,
	`created_by` bigint unsigned,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `limit_checks_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `limit_checks` ADD CONSTRAINT `limit_checks_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `limit_checks` ADD CONSTRAINT `limit_checks_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `limit_checks_capture` ON `limit_checks` (`capture_id`);