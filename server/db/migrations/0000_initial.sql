CREATE TABLE `annotations` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`capture_id` bigint unsigned NOT NULL,
	`channel_idx` int,
	`start_s` double NOT NULL,
	`end_s` double NOT NULL,
	`label` varchar(160) NOT NULL,
	`note` text NOT NULL,
	`severity` enum('info','warning','fault') NOT NULL DEFAULT 'info',
	`source` enum('user','finder') NOT NULL DEFAULT 'user',
	`state` enum('active','suggested','dismissed') NOT NULL DEFAULT 'active',
	`reason` text,
	`created_by` bigint unsigned,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`updated_at` timestamp NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `annotations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `captures` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`project_id` bigint unsigned NOT NULL,
	`name` varchar(200) NOT NULL,
	`status` enum('queued','processing','ready','failed') NOT NULL DEFAULT 'queued',
	`error_message` text,
	`error_line` int,
	`uploaded_by` bigint unsigned,
	`original_name` varchar(255) NOT NULL,
	`sha256` varchar(64) NOT NULL,
	`size_bytes` bigint NOT NULL,
	`original_path` varchar(255),
	`sample_rate_hint` double,
	`sample_rate` double,
	`sample_count` bigint,
	`t0` double,
	`detected` json,
	`metadata` json,
	`tags` json NOT NULL DEFAULT ('[]'),
	`engine_version` int,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`ready_at` timestamp,
	CONSTRAINT `captures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `channels` (
	`capture_id` bigint unsigned NOT NULL,
	`idx` int NOT NULL,
	`name` varchar(120) NOT NULL,
	`unit` varchar(20) NOT NULL,
	`invalid_count` int NOT NULL DEFAULT 0,
	`analysis` json,
	CONSTRAINT `channels_capture_id_idx_pk` PRIMARY KEY(`capture_id`,`idx`)
);
--> statement-breakpoint
CREATE TABLE `comments` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`capture_id` bigint unsigned NOT NULL,
	`body` text NOT NULL,
	`created_by` bigint unsigned,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `comments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `comparisons` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`capture_ids` json NOT NULL,
	`settings` json NOT NULL,
	`created_by` bigint unsigned,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `comparisons_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`kind` enum('ingest','reanalyse') NOT NULL,
	`capture_id` bigint unsigned NOT NULL,
	`status` enum('queued','running','done','failed') NOT NULL DEFAULT 'queued',
	`attempts` int NOT NULL DEFAULT 0,
	`last_error` text,
	`locked_by` varchar(80),
	`heartbeat_at` timestamp,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	`finished_at` timestamp,
	CONSTRAINT `jobs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `overviews` (
	`capture_id` bigint unsigned NOT NULL,
	`channel_idx` int NOT NULL,
	`bucket_size` int NOT NULL,
	`data` longblob NOT NULL,
	CONSTRAINT `overviews_capture_id_channel_idx_bucket_size_pk` PRIMARY KEY(`capture_id`,`channel_idx`,`bucket_size`)
);
--> statement-breakpoint
CREATE TABLE `projects` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`description` text NOT NULL,
	`archived` boolean NOT NULL DEFAULT false,
	`created_by` bigint unsigned,
	`default_for` bigint unsigned,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `projects_id` PRIMARY KEY(`id`),
	CONSTRAINT `projects_default_for_unique` UNIQUE(`default_for`)
);
--> statement-breakpoint
CREATE TABLE `sample_chunks` (
	`capture_id` bigint unsigned NOT NULL,
	`channel_idx` int NOT NULL,
	`chunk_idx` int NOT NULL,
	`start_index` bigint NOT NULL,
	`count` int NOT NULL,
	`data` longblob NOT NULL,
	CONSTRAINT `sample_chunks_capture_id_channel_idx_chunk_idx_pk` PRIMARY KEY(`capture_id`,`channel_idx`,`chunk_idx`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(100) NOT NULL,
	`role` enum('admin','engineer','viewer') NOT NULL,
	`active` boolean NOT NULL DEFAULT true,
	`created_at` timestamp NOT NULL DEFAULT (now()),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
ALTER TABLE `annotations` ADD CONSTRAINT `annotations_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `annotations` ADD CONSTRAINT `annotations_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `captures` ADD CONSTRAINT `captures_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `captures` ADD CONSTRAINT `captures_uploaded_by_users_id_fk` FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `channels` ADD CONSTRAINT `channels_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comments` ADD CONSTRAINT `comments_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `comparisons` ADD CONSTRAINT `comparisons_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `jobs` ADD CONSTRAINT `jobs_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `overviews` ADD CONSTRAINT `overviews_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `projects` ADD CONSTRAINT `projects_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `projects` ADD CONSTRAINT `projects_default_for_users_id_fk` FOREIGN KEY (`default_for`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_chunks` ADD CONSTRAINT `sample_chunks_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `annotations_capture` ON `annotations` (`capture_id`);--> statement-breakpoint
CREATE INDEX `captures_project` ON `captures` (`project_id`);--> statement-breakpoint
CREATE INDEX `captures_sha` ON `captures` (`sha256`);--> statement-breakpoint
CREATE INDEX `comments_capture` ON `comments` (`capture_id`);--> statement-breakpoint
CREATE INDEX `jobs_status` ON `jobs` (`status`,`id`);