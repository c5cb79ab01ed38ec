-- The default overrun allowance becomes the Florida shape with its $10 floor. SQLite cannot change a
-- column default in place, so the table is rebuilt: every existing row is copied as it is.
-- Then: running diagnosis clocks carry the moment they stop at the time box; extension lines.
PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_accounts` (
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
	`overrun_floor_cents` integer DEFAULT 1000 NOT NULL,
	`shop_supplies_exempt` integer DEFAULT false NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	`updated_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
INSERT INTO `__new_accounts`("id", "name", "billing_email", "phone", "address", "tax_exempt", "tax_exempt_certificate", "tax_rate_milli_pct", "po_required", "payment_terms_days", "standing_authorisation_cents", "repair_budget_cents", "fiscal_year_start_month", "overrun_percent_milli", "overrun_cap_cents", "overrun_floor_cents", "shop_supplies_exempt", "notes", "created_at", "updated_at") SELECT "id", "name", "billing_email", "phone", "address", "tax_exempt", "tax_exempt_certificate", "tax_rate_milli_pct", "po_required", "payment_terms_days", "standing_authorisation_cents", "repair_budget_cents", "fiscal_year_start_month", "overrun_percent_milli", "overrun_cap_cents", "overrun_floor_cents", "shop_supplies_exempt", "notes", "created_at", "updated_at" FROM `accounts`;--> statement-breakpoint
DROP TABLE `accounts`;--> statement-breakpoint
ALTER TABLE `__new_accounts` RENAME TO `accounts`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
ALTER TABLE `estimate_lines` ADD `extends_line_id` text;--> statement-breakpoint
ALTER TABLE `estimate_lines` ADD `box_warned_milli` integer;--> statement-breakpoint
ALTER TABLE `estimate_lines` ADD `box_reached_milli` integer;--> statement-breakpoint
ALTER TABLE `time_entries` ADD `stop_at` text;--> statement-breakpoint
ALTER TABLE `time_entries` ADD `stopped_by` text;--> statement-breakpoint
CREATE INDEX `time_entries_running_stop_idx` ON `time_entries` (`ended_at`,`stop_at`);