CREATE TABLE `invitations` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`account_id` text,
	`signing_limit_cents` integer,
	`token_hash` text NOT NULL,
	`expires_at` text NOT NULL,
	`sent_at` text NOT NULL,
	`invited_by` text,
	`accepted_at` text,
	`accepted_user_id` text,
	`withdrawn_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`invited_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`accepted_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_token_unique` ON `invitations` (`token_hash`);--> statement-breakpoint
CREATE UNIQUE INDEX `invitations_one_live_per_email` ON `invitations` (`email`) WHERE accepted_at is null and withdrawn_at is null;--> statement-breakpoint
CREATE INDEX `invitations_account_idx` ON `invitations` (`account_id`);--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` text NOT NULL,
	`used_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `password_resets_token_unique` ON `password_resets` (`token_hash`);--> statement-breakpoint
CREATE INDEX `password_resets_user_idx` ON `password_resets` (`user_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `service_request_defects` (
	`id` text PRIMARY KEY NOT NULL,
	`request_id` text NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`area` text DEFAULT '' NOT NULL,
	`description` text NOT NULL,
	`out_of_service` integer DEFAULT false NOT NULL,
	FOREIGN KEY (`request_id`) REFERENCES `service_requests`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `service_request_defects_request_idx` ON `service_request_defects` (`request_id`,`position`);--> statement-breakpoint
CREATE TABLE `service_requests` (
	`id` text PRIMARY KEY NOT NULL,
	`account_id` text NOT NULL,
	`unit_id` text NOT NULL,
	`reported_by` text,
	`reporter_name` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`odometer` real,
	`engine_hours` real,
	`note` text DEFAULT '' NOT NULL,
	`work_order_id` text,
	`scheduled_at` text,
	`closed_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reported_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `service_requests_account_status_idx` ON `service_requests` (`account_id`,`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `service_requests_status_idx` ON `service_requests` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `service_requests_unit_idx` ON `service_requests` (`unit_id`);--> statement-breakpoint
CREATE INDEX `service_requests_wo_idx` ON `service_requests` (`work_order_id`);--> statement-breakpoint
DROP INDEX `units_account_number_unique`;--> statement-breakpoint
ALTER TABLE `units` ADD `inspection_basis` text;--> statement-breakpoint
ALTER TABLE `units` ADD `retired_at` text;--> statement-breakpoint
CREATE UNIQUE INDEX `units_account_number_unique` ON `units` (`account_id`,`unit_number`) WHERE retired_at is null;--> statement-breakpoint
ALTER TABLE `accounts` ADD `archived_at` text;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `secret` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `photos` ADD `service_request_id` text REFERENCES service_requests(id);--> statement-breakpoint
ALTER TABLE `users` ADD `session_version` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
CREATE INDEX `work_orders_opened_idx` ON `work_orders` (`opened_at`);--> statement-breakpoint
-- Back-fill (hand-written): units inspected before this column existed had their due date
-- counted 12 months from the day, the periodic basis (49 CFR 396.17(c)).
UPDATE `units` SET `inspection_basis` = 'periodic' WHERE `last_inspection_on` IS NOT NULL;
