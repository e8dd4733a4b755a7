CREATE TABLE `sign_ups` (
	`id` varchar(32) NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`department_name` varchar(160) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	CONSTRAINT `sign_ups_id` PRIMARY KEY(`id`),
	CONSTRAINT `sign_ups_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE INDEX `sign_ups_email_idx` ON `sign_ups` (`email`);