CREATE TABLE `constraint_set_versions` (
	`set_id` varchar(32) NOT NULL,
	`version` int NOT NULL,
	`constraints` json NOT NULL,
	`note` text,
	`created_by_user_id` varchar(32) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `constraint_set_versions_set_id_version_pk` PRIMARY KEY(`set_id`,`version`)
);
--> statement-breakpoint
CREATE TABLE `constraint_sets` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`owner_user_id` varchar(32) NOT NULL,
	`name` varchar(160) NOT NULL,
	`current_version` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	`deleted_at` datetime(3),
	CONSTRAINT `constraint_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `constraint_set_versions` ADD CONSTRAINT `constraint_set_versions_set_id_constraint_sets_id_fk` FOREIGN KEY (`set_id`) REFERENCES `constraint_sets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `constraint_sets_department_idx` ON `constraint_sets` (`department_id`,`updated_at`);