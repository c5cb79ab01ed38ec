CREATE TABLE `credit_notes` (
	`id` text PRIMARY KEY NOT NULL,
	`number` integer NOT NULL,
	`invoice_id` text NOT NULL,
	`account_id` text NOT NULL,
	`amount_cents` integer NOT NULL,
	`reason` text NOT NULL,
	`core_line_id` text,
	`issued_at` text NOT NULL,
	`issued_by` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL,
	FOREIGN KEY (`invoice_id`) REFERENCES `invoices`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`core_line_id`) REFERENCES `estimate_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`issued_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `credit_notes_number_unique` ON `credit_notes` (`number`);--> statement-breakpoint
CREATE INDEX `credit_notes_invoice_idx` ON `credit_notes` (`invoice_id`);--> statement-breakpoint
CREATE INDEX `credit_notes_account_issued_idx` ON `credit_notes` (`account_id`,`issued_at`);--> statement-breakpoint
ALTER TABLE `invoices` ADD `credited_cents` integer DEFAULT 0 NOT NULL;