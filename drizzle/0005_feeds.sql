CREATE TABLE `feed_fetches` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`feed_id` int NOT NULL,
	`at` datetime(3) NOT NULL,
	`ip` varchar(64),
	`user_agent` varchar(300),
	`rows` int NOT NULL DEFAULT 0,
	`bytes` bigint NOT NULL DEFAULT 0,
	`status` smallint NOT NULL,
	`since` datetime(3),
	CONSTRAINT `feed_fetches_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `feeds` (
	`id` int AUTO_INCREMENT NOT NULL,
	`dealership_id` int NOT NULL,
	`name` varchar(120) NOT NULL,
	`format` enum('csv','json','jsonld','xml') NOT NULL,
	`filter` longtext NOT NULL,
	`columns` longtext,
	`units` enum('market','metric') NOT NULL DEFAULT 'market',
	`token_hash` varchar(64) NOT NULL,
	`token_hint` varchar(4) NOT NULL,
	`revoked_at` datetime(3),
	`created_by` varchar(255),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	`last_fetched_at` datetime(3),
	CONSTRAINT `feeds_id` PRIMARY KEY(`id`),
	CONSTRAINT `feeds_token_hash_uq` UNIQUE(`token_hash`)
);
--> statement-breakpoint
ALTER TABLE `feed_fetches` ADD CONSTRAINT `feed_fetches_feed_id_feeds_id_fk` FOREIGN KEY (`feed_id`) REFERENCES `feeds`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `feeds` ADD CONSTRAINT `feeds_dealership_id_dealerships_id_fk` FOREIGN KEY (`dealership_id`) REFERENCES `dealerships`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `feed_fetches_feed_idx` ON `feed_fetches` (`feed_id`,`at`);--> statement-breakpoint
CREATE INDEX `feeds_dealership_idx` ON `feeds` (`dealership_id`,`created_at`);