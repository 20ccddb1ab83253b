ALTER TABLE `captures` ADD `format` enum('csv','comtrade') DEFAULT 'csv' NOT NULL;--> statement-breakpoint
ALTER TABLE `captures` ADD `data_path` varchar(255);--> statement-breakpoint
ALTER TABLE `captures` ADD `data_name` varchar(255);--> statement-breakpoint
ALTER TABLE `captures` ADD `comtrade_values` enum('primary','secondary');--> statement-breakpoint
ALTER TABLE `captures` ADD `comtrade` json;