CREATE TABLE `run_checkpoint_points` (
	`run_id` varchar(32) NOT NULL,
	`point` int NOT NULL,
	`tally` mediumtext NOT NULL,
	CONSTRAINT `run_checkpoint_points_run_id_point_pk` PRIMARY KEY(`run_id`,`point`)
);
--> statement-breakpoint
ALTER TABLE `run_checkpoint_points` ADD CONSTRAINT `run_checkpoint_points_run_id_runs_id_fk` FOREIGN KEY (`run_id`) REFERENCES `runs`(`id`) ON DELETE cascade ON UPDATE no action;