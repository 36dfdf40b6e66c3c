CREATE TABLE `revision_media` (
	`revision_id` int NOT NULL,
	`key` varchar(200) NOT NULL,
	CONSTRAINT `revision_media_revision_id_key_pk` PRIMARY KEY(`revision_id`,`key`)
);
--> statement-breakpoint
CREATE TABLE `revisions` (
	`id` int AUTO_INCREMENT NOT NULL,
	`vehicle_id` int NOT NULL,
	`number` int NOT NULL,
	`slug` varchar(120) NOT NULL,
	`snapshot` longtext NOT NULL,
	`changes` longtext NOT NULL,
	`published_at` datetime(3) NOT NULL,
	`published_by` varchar(255),
	`published_by_name` varchar(120),
	`override_reason` text,
	`title` varchar(200) NOT NULL,
	`make` varchar(60) NOT NULL,
	`model` varchar(60) NOT NULL,
	`body_type` varchar(30),
	`fuel_type` varchar(30),
	`price_cents` int,
	`odometer_km` double,
	`build_year` int,
	`condition_index` double,
	CONSTRAINT `revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `revisions_number_uq` UNIQUE(`vehicle_id`,`number`)
);
--> statement-breakpoint
ALTER TABLE `vehicles` ADD `public_slug` varchar(120);--> statement-breakpoint
ALTER TABLE `vehicles` ADD `current_revision_id` int;--> statement-breakpoint
ALTER TABLE `vehicles` ADD `last_revision_number` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `vehicles` ADD CONSTRAINT `vehicles_publicSlug_unique` UNIQUE(`public_slug`);--> statement-breakpoint
ALTER TABLE `revision_media` ADD CONSTRAINT `revision_media_revision_id_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `revisions`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `revisions` ADD CONSTRAINT `revisions_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `revision_media_key_idx` ON `revision_media` (`key`);--> statement-breakpoint
CREATE INDEX `revisions_slug_idx` ON `revisions` (`slug`,`number`);--> statement-breakpoint
CREATE INDEX `revisions_published_idx` ON `revisions` (`published_at`);