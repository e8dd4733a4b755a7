CREATE TABLE `share_links` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`created_by_user_id` varchar(32) NOT NULL,
	`kind` varchar(16) NOT NULL,
	`object_id` varchar(32) NOT NULL,
	`secret_hash` char(64) NOT NULL,
	`prefix` varchar(16) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`last_opened_at` datetime(3),
	`revoked_at` datetime(3),
	CONSTRAINT `share_links_id` PRIMARY KEY(`id`),
	CONSTRAINT `share_links_secret_hash_unique` UNIQUE(`secret_hash`)
);
--> statement-breakpoint
CREATE INDEX `share_links_department_idx` ON `share_links` (`department_id`,`created_at`);