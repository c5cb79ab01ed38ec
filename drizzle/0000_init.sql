CREATE TABLE `account_contacts` (
	`id` text PRIMARY KEY NOT NULL,
	`account_id` text NOT NULL,
	`name` text NOT NULL,
	`title` text DEFAULT '' NOT NULL,
	`email` text DEFAULT '' NOT NULL,
	`phone` text DEFAULT '' NOT NULL,
	`is_billing` integer DEFAULT false NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `account_contacts_account_idx` ON `account_contacts` (`account_id`);--> statement-breakpoint
CREATE TABLE `accounts` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`billing_email` text DEFAULT '' NOT NULL,
	`phone` text DEFAULT '' NOT NULL,
	`address` text DEFAULT '' NOT NULL,
	`tax_exempt` integer DEFAULT false NOT NULL,
	`tax_exempt_certificate` text,
	`tax_rate_milli_pct` integer DEFAULT 0 NOT NULL,
	`po_required` integer DEFAULT false NOT NULL,
	`payment_terms_days` integer DEFAULT 30 NOT NULL,
	`standing_authorisation_cents` integer DEFAULT 0 NOT NULL,
	`repair_budget_cents` integer,
	`fiscal_year_start_month` integer DEFAULT 1 NOT NULL,
	`overrun_percent_milli` integer DEFAULT 10000 NOT NULL,
	`overrun_cap_cents` integer DEFAULT 5000,
	`overrun_floor_cents` integer DEFAULT 0 NOT NULL,
	`shop_supplies_exempt` integer DEFAULT false NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `api_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`name` text NOT NULL,
	`token_hash` text NOT NULL,
	`prefix` text NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`last_used_at` text,
	`revoked_at` text,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `api_tokens_hash_unique` ON `api_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `api_tokens_user_idx` ON `api_tokens` (`user_id`);--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` text PRIMARY KEY NOT NULL,
	`at` text NOT NULL,
	`actor_user_id` text,
	`actor_label` text NOT NULL,
	`action` text NOT NULL,
	`entity_type` text NOT NULL,
	`entity_id` text NOT NULL,
	`account_id` text,
	`detail` text,
	FOREIGN KEY (`actor_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `audit_entity_idx` ON `audit_log` (`entity_type`,`entity_id`);--> statement-breakpoint
CREATE INDEX `audit_account_idx` ON `audit_log` (`account_id`,`at`);--> statement-breakpoint
CREATE TABLE `checkout_sessions` (
	`id` text PRIMARY KEY NOT NULL,
	`invoice_id` text NOT NULL,
	`account_id` text NOT NULL,
	`amount_cents` integer NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`url` text NOT NULL,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`completed_at` text,
	FOREIGN KEY (`invoice_id`) REFERENCES `invoices`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `checkout_sessions_invoice_idx` ON `checkout_sessions` (`invoice_id`);--> statement-breakpoint
CREATE TABLE `concerns` (
	`id` text PRIMARY KEY NOT NULL,
	`unit_id` text NOT NULL,
	`work_order_id` text,
	`position` integer DEFAULT 0 NOT NULL,
	`complaint` text NOT NULL,
	`cause` text DEFAULT '' NOT NULL,
	`correction` text DEFAULT '' NOT NULL,
	`intermittent` integer DEFAULT false NOT NULL,
	`record_hint` text DEFAULT '' NOT NULL,
	`closed_at` text,
	`conclusion` text DEFAULT '' NOT NULL,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `concerns_wo_idx` ON `concerns` (`work_order_id`);--> statement-breakpoint
CREATE INDEX `concerns_unit_idx` ON `concerns` (`unit_id`);--> statement-breakpoint
CREATE TABLE `counters` (
	`name` text PRIMARY KEY NOT NULL,
	`value` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `decisions` (
	`id` text PRIMARY KEY NOT NULL,
	`line_id` text NOT NULL,
	`work_order_id` text NOT NULL,
	`account_id` text NOT NULL,
	`decision` text NOT NULL,
	`by_user_id` text,
	`by_standing` integer DEFAULT false NOT NULL,
	`amount_cents` integer NOT NULL,
	`line_version` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`at` text NOT NULL,
	FOREIGN KEY (`line_id`) REFERENCES `estimate_lines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `decisions_line_idx` ON `decisions` (`line_id`);--> statement-breakpoint
CREATE INDEX `decisions_account_at_idx` ON `decisions` (`account_id`,`at`);--> statement-breakpoint
CREATE INDEX `decisions_wo_idx` ON `decisions` (`work_order_id`);--> statement-breakpoint
CREATE TABLE `estimate_lines` (
	`id` text PRIMARY KEY NOT NULL,
	`work_order_id` text NOT NULL,
	`concern_id` text,
	`finding_id` text,
	`position` integer DEFAULT 0 NOT NULL,
	`kind` text NOT NULL,
	`description` text NOT NULL,
	`part_number` text DEFAULT '' NOT NULL,
	`quantity_milli` integer NOT NULL,
	`unit_price_cents` integer NOT NULL,
	`taxable` integer DEFAULT false NOT NULL,
	`core_charge_cents` integer DEFAULT 0 NOT NULL,
	`core_returned_at` text,
	`labor_rate_id` text,
	`is_diagnosis` integer DEFAULT false NOT NULL,
	`state` text DEFAULT 'draft' NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`approved_by_user_id` text,
	`by_standing` integer DEFAULT false NOT NULL,
	`approved_amount_cents` integer,
	`approved_at` text,
	`reopen_reason` text,
	`deferred_from_line_id` text,
	`brought_back_at` text,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`concern_id`) REFERENCES `concerns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`finding_id`) REFERENCES `findings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`labor_rate_id`) REFERENCES `labor_rates`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`approved_by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `estimate_lines_wo_idx` ON `estimate_lines` (`work_order_id`,`position`);--> statement-breakpoint
CREATE INDEX `estimate_lines_state_idx` ON `estimate_lines` (`state`);--> statement-breakpoint
CREATE TABLE `finding_readings` (
	`id` text PRIMARY KEY NOT NULL,
	`finding_id` text NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`kind` text NOT NULL,
	`location` text DEFAULT '' NOT NULL,
	`input` text NOT NULL,
	`value` real NOT NULL,
	`unit` text NOT NULL,
	`verdict` text NOT NULL,
	`limit_text` text NOT NULL,
	`limit_value` real,
	`source` text NOT NULL,
	`source_kind` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`finding_id`) REFERENCES `findings`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `finding_readings_finding_idx` ON `finding_readings` (`finding_id`);--> statement-breakpoint
CREATE TABLE `findings` (
	`id` text PRIMARY KEY NOT NULL,
	`work_order_id` text NOT NULL,
	`concern_id` text,
	`title` text NOT NULL,
	`severity` text NOT NULL,
	`note_markdown` text DEFAULT '' NOT NULL,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`concern_id`) REFERENCES `concerns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `findings_wo_idx` ON `findings` (`work_order_id`);--> statement-breakpoint
CREATE TABLE `invoice_lines` (
	`id` text PRIMARY KEY NOT NULL,
	`invoice_id` text NOT NULL,
	`source_line_id` text,
	`position` integer NOT NULL,
	`kind` text NOT NULL,
	`description` text NOT NULL,
	`part_number` text DEFAULT '' NOT NULL,
	`quantity_milli` integer NOT NULL,
	`unit_price_cents` integer NOT NULL,
	`amount_cents` integer NOT NULL,
	`taxable` integer NOT NULL,
	`core_charge_cents` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`invoice_id`) REFERENCES `invoices`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `invoice_lines_invoice_idx` ON `invoice_lines` (`invoice_id`);--> statement-breakpoint
CREATE TABLE `invoices` (
	`id` text PRIMARY KEY NOT NULL,
	`number` integer NOT NULL,
	`work_order_id` text NOT NULL,
	`account_id` text NOT NULL,
	`status` text DEFAULT 'open' NOT NULL,
	`po_number` text,
	`bill_to` text NOT NULL,
	`shop_snapshot` text,
	`unit_snapshot` text,
	`tax_exempt_certificate` text,
	`tax_rate_milli_pct` integer DEFAULT 0 NOT NULL,
	`terms_days` integer NOT NULL,
	`issued_at` text NOT NULL,
	`due_on` text NOT NULL,
	`labor_cents` integer DEFAULT 0 NOT NULL,
	`parts_cents` integer DEFAULT 0 NOT NULL,
	`sublet_cents` integer DEFAULT 0 NOT NULL,
	`fees_cents` integer DEFAULT 0 NOT NULL,
	`shop_supplies_cents` integer DEFAULT 0 NOT NULL,
	`taxable_cents` integer DEFAULT 0 NOT NULL,
	`tax_cents` integer DEFAULT 0 NOT NULL,
	`core_cents` integer DEFAULT 0 NOT NULL,
	`total_cents` integer NOT NULL,
	`paid_cents` integer DEFAULT 0 NOT NULL,
	`replaces_invoice_id` text,
	`voided_at` text,
	`voided_by` text,
	`void_reason` text,
	`issued_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`voided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`issued_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `invoices_number_unique` ON `invoices` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `invoices_one_live_per_wo` ON `invoices` (`work_order_id`) WHERE status <> 'void';--> statement-breakpoint
CREATE INDEX `invoices_account_status_idx` ON `invoices` (`account_id`,`status`);--> statement-breakpoint
CREATE INDEX `invoices_wo_idx` ON `invoices` (`work_order_id`);--> statement-breakpoint
CREATE TABLE `labor_rates` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`rate_cents` integer NOT NULL,
	`is_default` integer DEFAULT false NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`position` integer DEFAULT 0 NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `mail_log` (
	`id` text PRIMARY KEY NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`template` text NOT NULL,
	`link` text DEFAULT '' NOT NULL,
	`status` text NOT NULL,
	`error` text,
	`at` text NOT NULL
);
--> statement-breakpoint
CREATE INDEX `mail_log_at_idx` ON `mail_log` (`at`);--> statement-breakpoint
CREATE TABLE `meter_readings` (
	`id` text PRIMARY KEY NOT NULL,
	`unit_id` text NOT NULL,
	`kind` text NOT NULL,
	`value` real NOT NULL,
	`meter_replaced` integer DEFAULT false NOT NULL,
	`read_at` text NOT NULL,
	`work_order_id` text,
	`recorded_by` text,
	`note` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `meter_readings_unit_kind_idx` ON `meter_readings` (`unit_id`,`kind`,`read_at`);--> statement-breakpoint
CREATE TABLE `occurrences` (
	`id` text PRIMARY KEY NOT NULL,
	`unit_id` text NOT NULL,
	`account_id` text NOT NULL,
	`concern_id` text,
	`occurred_at` text NOT NULL,
	`hours_parked` real,
	`ambient_c` real,
	`symptom` text NOT NULL,
	`symptom_text` text DEFAULT '' NOT NULL,
	`battery_volts` real,
	`recovered` integer,
	`note` text DEFAULT '' NOT NULL,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`concern_id`) REFERENCES `concerns`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `occurrences_unit_idx` ON `occurrences` (`unit_id`,`occurred_at`);--> statement-breakpoint
CREATE INDEX `occurrences_concern_idx` ON `occurrences` (`concern_id`);--> statement-breakpoint
CREATE TABLE `payments` (
	`id` text PRIMARY KEY NOT NULL,
	`invoice_id` text NOT NULL,
	`account_id` text NOT NULL,
	`method` text NOT NULL,
	`amount_cents` integer NOT NULL,
	`reference` text DEFAULT '' NOT NULL,
	`received_at` text NOT NULL,
	`recorded_by` text,
	`checkout_session_id` text,
	`payment_intent_id` text,
	`flagged` integer DEFAULT false NOT NULL,
	`flag_reason` text,
	`applied` integer DEFAULT true NOT NULL,
	`resolution` text,
	`resolved_at` text,
	`resolved_by` text,
	`note` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`invoice_id`) REFERENCES `invoices`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`resolved_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `payments_invoice_idx` ON `payments` (`invoice_id`);--> statement-breakpoint
CREATE INDEX `payments_account_received_idx` ON `payments` (`account_id`,`received_at`);--> statement-breakpoint
CREATE UNIQUE INDEX `payments_payment_intent_unique` ON `payments` (`payment_intent_id`);--> statement-breakpoint
CREATE TABLE `photos` (
	`id` text PRIMARY KEY NOT NULL,
	`account_id` text NOT NULL,
	`unit_id` text NOT NULL,
	`work_order_id` text,
	`finding_id` text,
	`occurrence_id` text,
	`file_key` text NOT NULL,
	`file_url` text NOT NULL,
	`thumb_key` text,
	`thumb_url` text,
	`name` text DEFAULT '' NOT NULL,
	`size_bytes` integer DEFAULT 0 NOT NULL,
	`mime` text NOT NULL,
	`width` integer,
	`height` integer,
	`uploaded_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`finding_id`) REFERENCES `findings`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`occurrence_id`) REFERENCES `occurrences`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `photos_finding_idx` ON `photos` (`finding_id`);--> statement-breakpoint
CREATE INDEX `photos_wo_idx` ON `photos` (`work_order_id`);--> statement-breakpoint
CREATE TABLE `shop_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`shop_name` text NOT NULL,
	`address_line1` text DEFAULT '' NOT NULL,
	`address_line2` text DEFAULT '' NOT NULL,
	`phone` text DEFAULT '' NOT NULL,
	`email` text DEFAULT '' NOT NULL,
	`shop_supplies_rate_milli_pct` integer DEFAULT 0 NOT NULL,
	`shop_supplies_cap_cents` integer DEFAULT 0 NOT NULL,
	`shop_supplies_taxable` integer DEFAULT false NOT NULL,
	`tax_labor` integer DEFAULT false NOT NULL,
	`tax_parts` integer DEFAULT true NOT NULL,
	`tax_sublet` integer DEFAULT false NOT NULL,
	`tax_fees` integer DEFAULT false NOT NULL,
	`invoice_footer` text DEFAULT '' NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `sign_in_failures` (
	`id` text PRIMARY KEY NOT NULL,
	`ip` text NOT NULL,
	`email` text NOT NULL,
	`at` text NOT NULL
);
--> statement-breakpoint
CREATE INDEX `sign_in_failures_ip_at_idx` ON `sign_in_failures` (`ip`,`at`);--> statement-breakpoint
CREATE TABLE `status_events` (
	`id` text PRIMARY KEY NOT NULL,
	`work_order_id` text NOT NULL,
	`status` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`by_user_id` text,
	`at` text NOT NULL,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`by_user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `status_events_wo_idx` ON `status_events` (`work_order_id`,`at`);--> statement-breakpoint
CREATE TABLE `time_entries` (
	`id` text PRIMARY KEY NOT NULL,
	`line_id` text NOT NULL,
	`work_order_id` text NOT NULL,
	`tech_id` text NOT NULL,
	`started_at` text NOT NULL,
	`ended_at` text,
	`note` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`line_id`) REFERENCES `estimate_lines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`tech_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `time_entries_line_idx` ON `time_entries` (`line_id`);--> statement-breakpoint
CREATE INDEX `time_entries_tech_idx` ON `time_entries` (`tech_id`,`ended_at`);--> statement-breakpoint
CREATE TABLE `units` (
	`id` text PRIMARY KEY NOT NULL,
	`account_id` text NOT NULL,
	`unit_number` text NOT NULL,
	`vin` text,
	`serial_only` integer DEFAULT false NOT NULL,
	`serial_number` text,
	`year` integer,
	`description` text NOT NULL,
	`plate` text DEFAULT '' NOT NULL,
	`last_inspection_on` text,
	`inspection_due_on` text,
	`key_off_drain_limit_ma` integer,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `units_account_number_unique` ON `units` (`account_id`,`unit_number`);--> statement-breakpoint
CREATE INDEX `units_vin_idx` ON `units` (`vin`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`password_hash` text NOT NULL,
	`role` text NOT NULL,
	`account_id` text,
	`signing_limit_cents` integer,
	`phone` text DEFAULT '' NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`last_sign_in_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE INDEX `users_account_idx` ON `users` (`account_id`);--> statement-breakpoint
CREATE TABLE `webhook_events` (
	`id` text PRIMARY KEY NOT NULL,
	`type` text NOT NULL,
	`received_at` text NOT NULL,
	`result` text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE `work_orders` (
	`id` text PRIMARY KEY NOT NULL,
	`number` integer NOT NULL,
	`unit_id` text NOT NULL,
	`account_id` text NOT NULL,
	`status` text DEFAULT 'checked_in' NOT NULL,
	`title` text DEFAULT '' NOT NULL,
	`assigned_tech_id` text,
	`promised_at` text,
	`po_number` text,
	`opened_at` text NOT NULL,
	`sent_for_approval_at` text,
	`released_at` text,
	`created_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`unit_id`) REFERENCES `units`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assigned_tech_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `work_orders_number_unique` ON `work_orders` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `work_orders_one_open_per_unit` ON `work_orders` (`unit_id`) WHERE status <> 'released';--> statement-breakpoint
CREATE INDEX `work_orders_account_status_idx` ON `work_orders` (`account_id`,`status`);--> statement-breakpoint
CREATE INDEX `work_orders_unit_idx` ON `work_orders` (`unit_id`);--> statement-breakpoint
CREATE INDEX `work_orders_tech_idx` ON `work_orders` (`assigned_tech_id`);