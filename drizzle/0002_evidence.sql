CREATE TABLE `photos` (
	`id` int AUTO_INCREMENT NOT NULL,
	`vehicle_id` int NOT NULL,
	`status` enum('processing','ready','failed') NOT NULL DEFAULT 'processing',
	`position` int NOT NULL,
	`is_cover` boolean NOT NULL DEFAULT false,
	`caption` varchar(200) NOT NULL DEFAULT '',
	`zone` enum('front','bonnet','roof','left_side','right_side','rear','glass','wheels_tyres','interior_front','interior_rear','cargo_area','engine_bay','underbody'),
	`hash` varchar(64) NOT NULL,
	`master_key` varchar(200) NOT NULL,
	`width` int NOT NULL,
	`height` int NOT NULL,
	`placeholder` text NOT NULL,
	`variants` longtext NOT NULL,
	`uploaded_by` varchar(255),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `photos_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `defects` (
	`id` int AUTO_INCREMENT NOT NULL,
	`vehicle_id` int NOT NULL,
	`number` int NOT NULL,
	`zone` enum('front','bonnet','roof','left_side','right_side','rear','glass','wheels_tyres','interior_front','interior_rear','cargo_area','engine_bay','underbody') NOT NULL,
	`kind` enum('stone_chip','scratch','scuff','dent','kerb_rash','crack','corrosion','paint_fade','poor_repair','glass_chip','interior_wear','stain','tear','burn','missing_broken_part','mechanical_fault','electrical_fault') NOT NULL,
	`severity` enum('minor','moderate','major') NOT NULL,
	`size_mm` int,
	`note` varchar(1000) NOT NULL DEFAULT '',
	`repair_plan` enum('repaired_before_sale','disclosed_as_is','to_be_repaired') NOT NULL,
	`repair_cost_cents` int,
	`safety_relevant` boolean NOT NULL DEFAULT false,
	`photo_id` int,
	`pin_x` double,
	`pin_y` double,
	`closeup_key` varchar(200),
	`recorded_by` varchar(255),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `defects_id` PRIMARY KEY(`id`),
	CONSTRAINT `defects_number_uq` UNIQUE(`vehicle_id`,`number`)
);
--> statement-breakpoint
CREATE TABLE `zone_marks` (
	`vehicle_id` int NOT NULL,
	`zone` enum('front','bonnet','roof','left_side','right_side','rear','glass','wheels_tyres','interior_front','interior_rear','cargo_area','engine_bay','underbody') NOT NULL,
	`checked_by` varchar(120),
	`checked_at` datetime(3) NOT NULL,
	CONSTRAINT `zone_marks_vehicle_id_zone_pk` PRIMARY KEY(`vehicle_id`,`zone`)
);
--> statement-breakpoint
CREATE TABLE `tyre_readings` (
	`vehicle_id` int NOT NULL,
	`position` enum('front_left','front_right','rear_left','rear_right','spare') NOT NULL,
	`tread_inner_mm` double,
	`tread_centre_mm` double,
	`tread_outer_mm` double,
	`size_designation` varchar(40),
	`dot_code` varchar(4),
	`pressure_kpa` double,
	`measured_on` date NOT NULL,
	`measured_by` varchar(120),
	CONSTRAINT `tyre_readings_vehicle_id_position_pk` PRIMARY KEY(`vehicle_id`,`position`)
);
--> statement-breakpoint
CREATE TABLE `check_results` (
	`vehicle_id` int NOT NULL,
	`item` enum('brakes','lights','glass','wipers_washers','warning_lamps','climate','windows','seat_belts','keys','books','spare_tools') NOT NULL,
	`result` enum('pass','advise','fail') NOT NULL,
	`note` varchar(500) NOT NULL DEFAULT '',
	`checked_on` date NOT NULL,
	`checked_by` varchar(120),
	CONSTRAINT `check_results_vehicle_id_item_pk` PRIMARY KEY(`vehicle_id`,`item`)
);
--> statement-breakpoint
ALTER TABLE `vehicles` ADD `tyres_version` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `vehicles` ADD `checks_version` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `vehicles` ADD `last_defect_number` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `photos` ADD CONSTRAINT `photos_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `defects` ADD CONSTRAINT `defects_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `defects` ADD CONSTRAINT `defects_photo_id_photos_id_fk` FOREIGN KEY (`photo_id`) REFERENCES `photos`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `zone_marks` ADD CONSTRAINT `zone_marks_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tyre_readings` ADD CONSTRAINT `tyre_readings_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `check_results` ADD CONSTRAINT `check_results_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `photos_vehicle_idx` ON `photos` (`vehicle_id`,`position`);--> statement-breakpoint
CREATE INDEX `photos_status_idx` ON `photos` (`status`);--> statement-breakpoint
CREATE INDEX `photos_hash_idx` ON `photos` (`hash`);--> statement-breakpoint
CREATE INDEX `defects_photo_idx` ON `defects` (`photo_id`);