CREATE TABLE `vehicles` (
	`id` int AUTO_INCREMENT NOT NULL,
	`dealership_id` int NOT NULL,
	`stock_number` varchar(20) NOT NULL,
	`status` enum('intake','preparing','live','reserved','sold','archived','withdrawn') NOT NULL DEFAULT 'intake',
	`vin` varchar(17),
	`registration_plate` varchar(12),
	`make` varchar(60) NOT NULL,
	`model` varchar(60) NOT NULL,
	`variant` varchar(80),
	`build_year` int,
	`first_registration_date` date,
	`body_type` enum('hatchback','sedan','wagon','suv','ute','van','coupe','convertible','people_mover','cab_chassis'),
	`colour` varchar(40),
	`doors` int,
	`seats` int,
	`odometer_reading` int,
	`odometer_unit` enum('km','mi') NOT NULL DEFAULT 'km',
	`odometer_km_index` double,
	`drive_type` enum('fwd','rwd','awd','4wd'),
	`fuel_type` enum('petrol','diesel','hybrid','plug_in_hybrid','electric','lpg'),
	`engine_capacity_cc` int,
	`cylinders` int,
	`aspiration` enum('natural','turbo','supercharged'),
	`power_kw` double,
	`torque_nm` double,
	`transmission` enum('manual','automatic','cvt','dual_clutch'),
	`gears` int,
	`fuel_tank_litres` double,
	`fuel_consumption_l_100km` double,
	`consumption_test_cycle` enum('wltp','nedc','epa','measured'),
	`battery_kwh` double,
	`energy_kwh100km` double,
	`kerb_weight_kg` double,
	`keys_count` int,
	`previous_owners` int,
	`features` longtext NOT NULL,
	`price_cents` int,
	`description` text,
	`service_history` longtext NOT NULL,
	`derived` longtext NOT NULL,
	`stocked_at` datetime(3) NOT NULL,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `vehicles_id` PRIMARY KEY(`id`),
	CONSTRAINT `vehicles_stock_number_uq` UNIQUE(`dealership_id`,`stock_number`)
);
--> statement-breakpoint
CREATE TABLE `vehicle_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`vehicle_id` int NOT NULL,
	`from_status` enum('intake','preparing','live','reserved','sold','archived','withdrawn'),
	`to_status` enum('intake','preparing','live','reserved','sold','archived','withdrawn') NOT NULL,
	`note` varchar(500) NOT NULL DEFAULT '',
	`user_id` varchar(255),
	`user_name` varchar(120),
	`at` datetime(3) NOT NULL,
	CONSTRAINT `vehicle_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `dealerships` ADD `last_stock_number` int DEFAULT 10000 NOT NULL;--> statement-breakpoint
ALTER TABLE `vehicles` ADD CONSTRAINT `vehicles_dealership_id_dealerships_id_fk` FOREIGN KEY (`dealership_id`) REFERENCES `dealerships`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `vehicle_events` ADD CONSTRAINT `vehicle_events_vehicle_id_vehicles_id_fk` FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `vehicles_status_stocked_idx` ON `vehicles` (`dealership_id`,`status`,`stocked_at`);--> statement-breakpoint
CREATE INDEX `vehicles_make_idx` ON `vehicles` (`dealership_id`,`make`,`model`);--> statement-breakpoint
CREATE INDEX `vehicles_vin_idx` ON `vehicles` (`vin`);--> statement-breakpoint
CREATE INDEX `vehicles_plate_idx` ON `vehicles` (`registration_plate`);--> statement-breakpoint
CREATE INDEX `vehicles_price_idx` ON `vehicles` (`dealership_id`,`price_cents`);--> statement-breakpoint
CREATE INDEX `vehicles_odometer_idx` ON `vehicles` (`dealership_id`,`odometer_km_index`);--> statement-breakpoint
CREATE INDEX `vehicle_events_vehicle_idx` ON `vehicle_events` (`vehicle_id`,`at`);