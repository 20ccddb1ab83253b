CREATE TABLE `meter_profiles` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`scope` enum('project','account') NOT NULL,
	`project_id` bigint unsigned,
	`created_by` bigint unsigned NOT NULL,
	`profile` json NOT NULL,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `meter_profiles_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `meter_profiles` ADD CONSTRAINT `meter_profiles_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `meter_profiles` ADD CONSTRAINT `meter_profiles_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `meter_profiles_project` ON `meter_profiles` (`project_id`);--> statement-breakpoint
CREATE INDEX `meter_profiles_creator` ON `meter_profiles` (`created_by`);