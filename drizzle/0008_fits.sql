CREATE TABLE `fits` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`owner_user_id` varchar(32) NOT NULL,
	`name` varchar(160) NOT NULL,
	`scenario_id` varchar(32) NOT NULL,
	`scenario_version` int NOT NULL,
	`scenario_name` varchar(160) NOT NULL,
	`constraint_set_id` varchar(32) NOT NULL,
	`constraint_set_version` int,
	`constraint_set_name` varchar(160) NOT NULL,
	`constraints` json NOT NULL,
	`parameters` json NOT NULL,
	`seed` varchar(200) NOT NULL,
	`systems` bigint NOT NULL,
	`point_count` int NOT NULL,
	`run_id` varchar(32) NOT NULL,
	`engine_version` varchar(40) NOT NULL,
	`posterior` longtext,
	`methods` text,
	`error` text,
	`created_at` datetime(3) NOT NULL,
	`finished_at` datetime(3),
	CONSTRAINT `fits_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `runs` ADD `job_points` json;--> statement-breakpoint
ALTER TABLE `runs` ADD `job_run_id` varchar(32);--> statement-breakpoint
ALTER TABLE `runs` ADD `fit_id` varchar(32);--> statement-breakpoint
CREATE INDEX `fits_department_idx` ON `fits` (`department_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `fits_run_idx` ON `fits` (`run_id`);--> statement-breakpoint
CREATE INDEX `runs_job_idx` ON `runs` (`job_run_id`);