CREATE TABLE `api_tokens` (
	`id` varchar(32) NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`name` varchar(120) NOT NULL,
	`secret_hash` char(64) NOT NULL,
	`prefix` varchar(16) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`last_used_at` datetime(3),
	`expires_at` datetime(3),
	`revoked_at` datetime(3),
	CONSTRAINT `api_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `api_tokens_secret_hash_unique` UNIQUE(`secret_hash`)
);
--> statement-breakpoint
CREATE TABLE `engulfment_grids` (
	`grid_key` char(64) NOT NULL,
	`grid` longtext NOT NULL,
	`build_ms` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `engulfment_grids_grid_key` PRIMARY KEY(`grid_key`)
);
--> statement-breakpoint
CREATE TABLE `occurrence_rows` (
	`table_id` varchar(32) NOT NULL,
	`position` int NOT NULL,
	`companion_class` varchar(16) NOT NULL,
	`occurrence` double NOT NULL,
	`period_min_days` double NOT NULL,
	`period_max_days` double NOT NULL,
	`row` json NOT NULL,
	CONSTRAINT `occurrence_rows_table_id_position_pk` PRIMARY KEY(`table_id`,`position`)
);
--> statement-breakpoint
CREATE TABLE `occurrence_tables` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`owner_user_id` varchar(32) NOT NULL,
	`name` varchar(160) NOT NULL,
	`description` text,
	`row_count` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `occurrence_tables_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `run_bins` (
	`run_id` varchar(32) NOT NULL,
	`histogram` varchar(16) NOT NULL,
	`series` varchar(16) NOT NULL,
	`bin` int NOT NULL,
	`bin2` int NOT NULL DEFAULT 0,
	`lo` double NOT NULL,
	`hi` double NOT NULL,
	`lo2` double,
	`hi2` double,
	`count` bigint NOT NULL,
	CONSTRAINT `run_bins_run_id_histogram_series_bin_bin2_pk` PRIMARY KEY(`run_id`,`histogram`,`series`,`bin`,`bin2`)
);
--> statement-breakpoint
CREATE TABLE `run_checkpoints` (
	`run_id` varchar(32) NOT NULL,
	`tally` longtext NOT NULL,
	`done_chunks` json NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `run_checkpoints_run_id` PRIMARY KEY(`run_id`)
);
--> statement-breakpoint
CREATE TABLE `run_results` (
	`run_id` varchar(32) NOT NULL,
	`result` longtext NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `run_results_run_id` PRIMARY KEY(`run_id`)
);
--> statement-breakpoint
CREATE TABLE `runs` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`owner_user_id` varchar(32) NOT NULL,
	`scenario_id` varchar(32) NOT NULL,
	`scenario_version` int NOT NULL,
	`scenario_name` varchar(160) NOT NULL,
	`snapshot` json NOT NULL,
	`scenario_hash` char(64) NOT NULL,
	`seed` varchar(200) NOT NULL,
	`systems` bigint NOT NULL,
	`engine_version` varchar(40) NOT NULL,
	`status` enum('queued','running','succeeded','failed','cancelled') NOT NULL,
	`chunk_count` int NOT NULL,
	`chunks_done` int NOT NULL DEFAULT 0,
	`progress` double NOT NULL DEFAULT 0,
	`cost_credits` int NOT NULL,
	`white_dwarfs` bigint,
	`magnetic` bigint,
	`fraction` double,
	`fraction_se` double,
	`error` text,
	`sweep_id` varchar(32),
	`sweep_point_index` int,
	`resumes` int NOT NULL DEFAULT 0,
	`created_at` datetime(3) NOT NULL,
	`started_at` datetime(3),
	`finished_at` datetime(3),
	`compute_ms` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `runs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sample_bins` (
	`id` int AUTO_INCREMENT NOT NULL,
	`sample_id` varchar(32) NOT NULL,
	`kind` enum('setting','massBin') NOT NULL,
	`setting` enum('single','wide','postCE','detachedCompanion'),
	`mass_min_msun` double,
	`mass_max_msun` double,
	`magnetic` int NOT NULL,
	`total` int NOT NULL,
	CONSTRAINT `sample_bins_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `samples` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32),
	`owner_user_id` varchar(32),
	`library_key` varchar(64),
	`name` varchar(200) NOT NULL,
	`kind` enum('counts','fraction','meanMass') NOT NULL,
	`magnetic` int,
	`total` int,
	`fraction` double,
	`fraction_sigma` double,
	`lower_bound` boolean NOT NULL DEFAULT false,
	`mean_mass_magnetic_msun` double,
	`mean_mass_magnetic_sigma` double,
	`mean_mass_non_magnetic_msun` double,
	`mean_mass_non_magnetic_sigma` double,
	`field_threshold_mg` double,
	`setting` enum('all','single','detachedCompanion') NOT NULL DEFAULT 'all',
	`provenance` text,
	`citation` text,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `samples_id` PRIMARY KEY(`id`),
	CONSTRAINT `samples_library_key_unique` UNIQUE(`library_key`)
);
--> statement-breakpoint
CREATE TABLE `scenario_versions` (
	`scenario_id` varchar(32) NOT NULL,
	`version` int NOT NULL,
	`document` json NOT NULL,
	`document_hash` char(64) NOT NULL,
	`note` text,
	`created_by_user_id` varchar(32) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `scenario_versions_scenario_id_version_pk` PRIMARY KEY(`scenario_id`,`version`)
);
--> statement-breakpoint
CREATE TABLE `scenarios` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`owner_user_id` varchar(32) NOT NULL,
	`name` varchar(160) NOT NULL,
	`current_version` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	`deleted_at` datetime(3),
	CONSTRAINT `scenarios_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sweeps` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`owner_user_id` varchar(32) NOT NULL,
	`scenario_id` varchar(32) NOT NULL,
	`scenario_version` int NOT NULL,
	`name` varchar(160) NOT NULL,
	`axes` json NOT NULL,
	`seed` varchar(200) NOT NULL,
	`systems` bigint NOT NULL,
	`point_count` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `sweeps_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `api_tokens` ADD CONSTRAINT `api_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `occurrence_rows` ADD CONSTRAINT `occurrence_rows_table_id_occurrence_tables_id_fk` FOREIGN KEY (`table_id`) REFERENCES `occurrence_tables`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_bins` ADD CONSTRAINT `run_bins_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_checkpoints` ADD CONSTRAINT `run_checkpoints_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `run_results` ADD CONSTRAINT `run_results_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sample_bins` ADD CONSTRAINT `sample_bins_sample_id_samples_id_fk` FOREIGN KEY (`sample_id`) REFERENCES `samples`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `scenario_versions` ADD CONSTRAINT `scenario_versions_scenario_id_scenarios_id_fk` FOREIGN KEY (`scenario_id`) REFERENCES `scenarios`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `api_tokens_user_idx` ON `api_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `occurrence_tables_department_idx` ON `occurrence_tables` (`department_id`,`updated_at`);--> statement-breakpoint
CREATE INDEX `runs_department_idx` ON `runs` (`department_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `runs_status_idx` ON `runs` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `runs_sweep_idx` ON `runs` (`sweep_id`,`sweep_point_index`);--> statement-breakpoint
CREATE INDEX `sample_bins_sample_idx` ON `sample_bins` (`sample_id`);--> statement-breakpoint
CREATE INDEX `samples_department_idx` ON `samples` (`department_id`,`updated_at`);--> statement-breakpoint
CREATE INDEX `scenarios_department_idx` ON `scenarios` (`department_id`,`updated_at`);--> statement-breakpoint
CREATE INDEX `sweeps_department_idx` ON `sweeps` (`department_id`,`created_at`);