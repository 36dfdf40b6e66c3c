CREATE TABLE `lead_notes` (
	`id` int AUTO_INCREMENT NOT NULL,
	`lead_id` int NOT NULL,
	`kind` enum('note','status','mail_out','enquiry') NOT NULL,
	`body` text NOT NULL,
	`user_id` varchar(255),
	`user_name` varchar(120),
	`outbox_id` int,
	`at` datetime(3) NOT NULL,
	CONSTRAINT `lead_notes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `leads` (
	`id` int AUTO_INCREMENT NOT NULL,
	`dealership_id` int NOT NULL,
	`vehicle_id` int NOT NULL,
	`revision_number` int,
	`name` varchar(120) NOT NULL,
	`email` varchar(254) NOT NULL DEFAULT '',
	`phone` varchar(40) NOT NULL DEFAULT '',
	`message` text NOT NULL,
	`preferred_contact` enum('email','phone','either') NOT NULL,
	`trade_in` longtext,
	`consent` boolean NOT NULL,
	`source` varchar(40) NOT NULL DEFAULT 'condition_page',
	`status` enum('waiting','talking','test_drive','offer','won','lost') NOT NULL DEFAULT 'waiting',
	`assignee_id` varchar(255),
	`follow_up_on` date,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `leads_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `auth_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`kind` enum('invite','reset') NOT NULL,
	`token_hash` varchar(64) NOT NULL,
	`dealership_id` int NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL DEFAULT '',
	`role` enum('admin','sales','workshop','marketing'),
	`user_id` varchar(255),
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	`created_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `auth_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `auth_tokens_tokenHash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `captured_mail` (
	`id` int AUTO_INCREMENT NOT NULL,
	`from_address` varchar(300) NOT NULL,
	`to_address` varchar(1000) NOT NULL,
	`subject` varchar(300) NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`received_at` datetime(3) NOT NULL,
	CONSTRAINT `captured_mail_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `outbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`to_address` varchar(254) NOT NULL,
	`subject` varchar(300) NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`kind` varchar(40) NOT NULL,
	`status` enum('pending','sent','failed') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL,
	`last_error` varchar(500),
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `vehicles` ADD `salesperson_id` varchar(255);--> statement-breakpoint
ALTER TABLE `lead_notes` ADD CONSTRAINT `lead_notes_lead_id_leads_id_fk` FOREIGN KEY (`lead_id`) REFERENCES `leads`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `leads` ADD CONSTRAINT `leads_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `lead_notes_lead_idx` ON `lead_notes` (`lead_id`,`at`);--> statement-breakpoint
CREATE INDEX `leads_dealership_idx` ON `leads` (`dealership_id`,`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `leads_vehicle_idx` ON `leads` (`vehicle_id`);--> statement-breakpoint
CREATE INDEX `auth_tokens_email_idx` ON `auth_tokens` (`email`,`kind`);--> statement-breakpoint
CREATE INDEX `outbox_due_idx` ON `outbox` (`status`,`next_attempt_at`);