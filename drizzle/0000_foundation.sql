CREATE TABLE `dealerships` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`name` varchar(160) NOT NULL,
	`address_line` varchar(200) NOT NULL DEFAULT '',
	`town` varchar(120) NOT NULL DEFAULT '',
	`region` varchar(120) NOT NULL DEFAULT '',
	`postcode` varchar(20) NOT NULL DEFAULT '',
	`country` varchar(2) NOT NULL,
	`licence_number` varchar(60) NOT NULL DEFAULT '',
	`phone` varchar(40) NOT NULL DEFAULT '',
	`email` varchar(254) NOT NULL DEFAULT '',
	`website` varchar(300) NOT NULL DEFAULT '',
	`logo_path` varchar(300),
	`market` enum('AU','NZ','UK','EU','US','CA_ON','CA_QC') NOT NULL,
	`locale` varchar(20) NOT NULL,
	`time_zone` varchar(60) NOT NULL,
	`distance_unit` enum('km','mi') NOT NULL,
	`currency` varchar(3) NOT NULL,
	`legal_min_tread_mm` double NOT NULL,
	`new_tyre_tread_mm` double NOT NULL DEFAULT 8,
	`vin_check_digit_mandatory` boolean NOT NULL,
	`service_interval_km` int NOT NULL DEFAULT 15000,
	`service_interval_months` int NOT NULL DEFAULT 12,
	`min_photos` int NOT NULL DEFAULT 6,
	`disclaimer_markdown` text NOT NULL,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `dealerships_id` PRIMARY KEY(`id`),
	CONSTRAINT `dealerships_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` varchar(255) NOT NULL,
	`dealership_id` int NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`role` enum('admin','sales','workshop','marketing') NOT NULL,
	`active` boolean NOT NULL DEFAULT true,
	`password_hash` varchar(255) NOT NULL,
	`last_sign_in_at` datetime(3),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` varchar(255) NOT NULL,
	`user_id` varchar(255) NOT NULL,
	`expires_at` datetime NOT NULL,
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`dealership_id` int NOT NULL,
	`user_id` varchar(255),
	`user_email` varchar(254),
	`action` varchar(60) NOT NULL,
	`entity_type` varchar(40) NOT NULL,
	`entity_id` varchar(255) NOT NULL,
	`before` longtext,
	`after` longtext,
	`at` datetime(3) NOT NULL,
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rate_limits` (
	`key` varchar(255) NOT NULL,
	`points` int NOT NULL DEFAULT 0,
	`expire` bigint unsigned,
	CONSTRAINT `rate_limits_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
ALTER TABLE `users` ADD CONSTRAINT `users_dealership_id_dealerships_id_fk` FOREIGN KEY (`dealership_id`) REFERENCES `dealerships`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `users_dealership_idx` ON `users` (`dealership_id`);--> statement-breakpoint
CREATE INDEX `sessions_user_idx` ON `sessions` (`user_id`);--> statement-breakpoint
CREATE INDEX `audit_entity_idx` ON `audit_log` (`entity_type`,`entity_id`,`at`);--> statement-breakpoint
CREATE INDEX `audit_dealership_idx` ON `audit_log` (`dealership_id`,`at`);