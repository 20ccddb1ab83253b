CREATE TABLE `probe_presets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`project_id` bigint unsigned NOT NULL,
	`name` varchar(80) NOT NULL,
	`unit` varchar(8) NOT NULL,
	`scale` double NOT NULL,
	`offset` double NOT NULL DEFAULT 0,
	`invert` boolean NOT NULL DEFAULT false,
	`created_by` bigint unsigned,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `probe_presets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `captures` ADD `channel_setup` json DEFAULT ('[]') NOT NULL;--> statement-breakpoint
ALTER TABLE `captures` ADD `systems` json;--> statement-breakpoint
ALTER TABLE `captures` ADD `declared_voltage` double;--> statement-breakpoint
ALTER TABLE `captures` ADD `power_quality` json;--> statement-breakpoint
ALTER TABLE `projects` ADD `declared_voltage` double;--> statement-breakpoint
ALTER TABLE `probe_presets` ADD CONSTRAINT `probe_presets_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `probe_presets` ADD CONSTRAINT `probe_presets_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `probe_presets_project` ON `probe_presets` (`project_id`);