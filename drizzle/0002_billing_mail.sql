CREATE TABLE `billing_accounts` (
	`department_id` varchar(32) NOT NULL,
	`balance_credits` int NOT NULL DEFAULT 0,
	`allowance_period` char(7),
	`free_systems_left` bigint NOT NULL DEFAULT 0,
	`payment_customer_id` varchar(255),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `billing_accounts_department_id` PRIMARY KEY(`department_id`)
);
--> statement-breakpoint
CREATE TABLE `credit_checkouts` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`pack_id` varchar(40) NOT NULL,
	`credits` int NOT NULL,
	`unit_amount` int NOT NULL,
	`currency` char(3) NOT NULL,
	`session_id` varchar(255),
	`status` enum('open','paid','declined','expired','failed') NOT NULL,
	`failure_message` varchar(500),
	`receipt_number` varchar(32),
	`created_by_user_id` varchar(32) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`paid_at` datetime(3),
	CONSTRAINT `credit_checkouts_id` PRIMARY KEY(`id`),
	CONSTRAINT `credit_checkouts_session_id_unique` UNIQUE(`session_id`),
	CONSTRAINT `credit_checkouts_receipt_number_unique` UNIQUE(`receipt_number`)
);
--> statement-breakpoint
CREATE TABLE `credit_ledger` (
	`id` int AUTO_INCREMENT NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`kind` enum('purchase','reservation','settlement','refund','allowance','adjustment') NOT NULL,
	`credits` int NOT NULL,
	`free_systems` bigint NOT NULL DEFAULT 0,
	`period` char(7) NOT NULL,
	`balance_after` int NOT NULL,
	`run_id` varchar(32),
	`checkout_id` varchar(32),
	`actor_user_id` varchar(32),
	`reason` varchar(500),
	`idempotency_key` varchar(120) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `credit_ledger_id` PRIMARY KEY(`id`),
	CONSTRAINT `credit_ledger_idempotency_key_unique` UNIQUE(`idempotency_key`)
);
--> statement-breakpoint
CREATE TABLE `invitations` (
	`id` varchar(32) NOT NULL,
	`department_id` varchar(32) NOT NULL,
	`email` varchar(254) NOT NULL,
	`role` enum('observer','modeller','admin') NOT NULL,
	`token_hash` char(64) NOT NULL,
	`invited_by_user_id` varchar(32) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`accepted_at` datetime(3),
	`accepted_by_user_id` varchar(32),
	`revoked_at` datetime(3),
	CONSTRAINT `invitations_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitations_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `notification_settings` (
	`user_id` varchar(32) NOT NULL,
	`run_finished` boolean NOT NULL DEFAULT true,
	`run_failed` boolean NOT NULL DEFAULT true,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `notification_settings_user_id` PRIMARY KEY(`user_id`)
);
--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` varchar(32) NOT NULL,
	`user_id` varchar(32) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`used_at` datetime(3),
	CONSTRAINT `password_resets_id` PRIMARY KEY(`id`),
	CONSTRAINT `password_resets_token_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `payment_events` (
	`event_id` varchar(255) NOT NULL,
	`type` varchar(100) NOT NULL,
	`checkout_id` varchar(32),
	`outcome` varchar(40) NOT NULL,
	`received_at` datetime(3) NOT NULL,
	CONSTRAINT `payment_events_event_id` PRIMARY KEY(`event_id`)
);
--> statement-breakpoint
ALTER TABLE `billing_accounts` ADD CONSTRAINT `billing_accounts_department_id_departments_id_fk` FOREIGN KEY (`department_id`) REFERENCES `departments`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_department_id_departments_id_fk` FOREIGN KEY (`department_id`) REFERENCES `departments`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `notification_settings` ADD CONSTRAINT `notification_settings_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `password_resets` ADD CONSTRAINT `password_resets_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `credit_checkouts_department_idx` ON `credit_checkouts` (`department_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `credit_ledger_department_idx` ON `credit_ledger` (`department_id`,`id`);--> statement-breakpoint
CREATE INDEX `credit_ledger_run_idx` ON `credit_ledger` (`run_id`);--> statement-breakpoint
CREATE INDEX `invitations_department_idx` ON `invitations` (`department_id`,`email`);--> statement-breakpoint
CREATE INDEX `password_resets_user_idx` ON `password_resets` (`user_id`);