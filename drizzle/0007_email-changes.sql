CREATE TABLE `email_changes` (
	`id` varchar(32) NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`new_email` varchar(254) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	CONSTRAINT `email_changes_id` PRIMARY KEY(`id`),
	CONSTRAINT `email_changes_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
ALTER TABLE `email_changes` ADD CONSTRAINT `email_changes_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `email_changes_user_idx` ON `email_changes` (`user_id`);