DROP INDEX `estimate_lines_state_idx`;--> statement-breakpoint
CREATE INDEX `estimate_lines_deferred_idx` ON `estimate_lines` (`work_order_id`,`updated_at`) WHERE state in ('held', 'declined') and brought_back_at is null;--> statement-breakpoint
DROP INDEX `audit_entity_idx`;--> statement-breakpoint
CREATE INDEX `audit_entity_idx` ON `audit_log` (`entity_type`,`entity_id`,`at`);--> statement-breakpoint
DROP INDEX `concerns_wo_idx`;--> statement-breakpoint
DROP INDEX `concerns_unit_idx`;--> statement-breakpoint
CREATE INDEX `concerns_wo_idx` ON `concerns` (`work_order_id`,`position`);--> statement-breakpoint
CREATE INDEX `concerns_unit_idx` ON `concerns` (`unit_id`,`created_at`);--> statement-breakpoint
DROP INDEX `credit_notes_invoice_idx`;--> statement-breakpoint
CREATE INDEX `credit_notes_invoice_idx` ON `credit_notes` (`invoice_id`,`number`);--> statement-breakpoint
DROP INDEX `decisions_wo_idx`;--> statement-breakpoint
CREATE INDEX `decisions_wo_idx` ON `decisions` (`work_order_id`,`at`);--> statement-breakpoint
DROP INDEX `findings_wo_idx`;--> statement-breakpoint
CREATE INDEX `findings_wo_idx` ON `findings` (`work_order_id`,`created_at`);--> statement-breakpoint
DROP INDEX `invoice_lines_invoice_idx`;--> statement-breakpoint
CREATE INDEX `invoice_lines_invoice_idx` ON `invoice_lines` (`invoice_id`,`position`);--> statement-breakpoint
DROP INDEX `invoices_wo_idx`;--> statement-breakpoint
CREATE INDEX `invoices_account_number_idx` ON `invoices` (`account_id`,`number`);--> statement-breakpoint
CREATE INDEX `invoices_account_status_number_idx` ON `invoices` (`account_id`,`status`,`number`);--> statement-breakpoint
CREATE INDEX `invoices_status_number_idx` ON `invoices` (`status`,`number`);--> statement-breakpoint
CREATE INDEX `invoices_account_status_due_idx` ON `invoices` (`account_id`,`status`,`due_on`);--> statement-breakpoint
CREATE INDEX `invoices_status_due_idx` ON `invoices` (`status`,`due_on`);--> statement-breakpoint
CREATE INDEX `invoices_replaces_idx` ON `invoices` (`replaces_invoice_id`);--> statement-breakpoint
CREATE INDEX `invoices_wo_idx` ON `invoices` (`work_order_id`,`number`);--> statement-breakpoint
DROP INDEX `mail_outbox_created_idx`;--> statement-breakpoint
CREATE INDEX `mail_outbox_status_created_idx` ON `mail_outbox` (`status`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `mail_outbox_created_idx` ON `mail_outbox` (`created_at`,`id`);--> statement-breakpoint
DROP INDEX `payments_invoice_idx`;--> statement-breakpoint
CREATE INDEX `payments_invoice_idx` ON `payments` (`invoice_id`,`received_at`);--> statement-breakpoint
DROP INDEX `photos_wo_idx`;--> statement-breakpoint
CREATE INDEX `photos_wo_idx` ON `photos` (`work_order_id`,`created_at`);--> statement-breakpoint
DROP INDEX `work_orders_unit_idx`;--> statement-breakpoint
CREATE INDEX `work_orders_open_number_idx` ON `work_orders` (`number`) WHERE status <> 'released';--> statement-breakpoint
CREATE INDEX `work_orders_open_account_number_idx` ON `work_orders` (`account_id`,`number`) WHERE status <> 'released';--> statement-breakpoint
CREATE INDEX `work_orders_open_tech_number_idx` ON `work_orders` (`assigned_tech_id`,`number`) WHERE status <> 'released';--> statement-breakpoint
CREATE INDEX `work_orders_account_number_idx` ON `work_orders` (`account_id`,`number`);--> statement-breakpoint
CREATE INDEX `work_orders_status_number_idx` ON `work_orders` (`status`,`number`);--> statement-breakpoint
CREATE INDEX `work_orders_unit_idx` ON `work_orders` (`unit_id`,`opened_at`);--> statement-breakpoint
CREATE INDEX `accounts_name_idx` ON `accounts` (`name`);--> statement-breakpoint
CREATE INDEX `meter_readings_unit_at_idx` ON `meter_readings` (`unit_id`,`read_at`);--> statement-breakpoint
CREATE INDEX `service_requests_account_created_idx` ON `service_requests` (`account_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `service_requests_created_idx` ON `service_requests` (`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `time_entries_wo_idx` ON `time_entries` (`work_order_id`,(ended_at is null),`started_at`);--> statement-breakpoint
CREATE INDEX `units_number_idx` ON `units` (`unit_number`,`id`);