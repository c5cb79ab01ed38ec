CREATE TABLE `mail_outbox` (
	`id` text PRIMARY KEY NOT NULL,
	`to` text NOT NULL,
	`subject` text NOT NULL,
	`text` text NOT NULL,
	`html` text NOT NULL,
	`template` text NOT NULL,
	`link` text DEFAULT '' NOT NULL,
	`attachments` text DEFAULT '[]' NOT NULL,
	`group_key` text,
	`group_items` text,
	`status` text DEFAULT 'queued' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`send_after` text NOT NULL,
	`claimed_at` text,
	`last_error` text,
	`sent_at` text,
	`created_at` text DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`status`,`send_after`);--> statement-breakpoint
CREATE INDEX `mail_outbox_group_idx` ON `mail_outbox` (`group_key`,`status`);--> statement-breakpoint
CREATE INDEX `mail_outbox_created_idx` ON `mail_outbox` (`created_at`);--> statement-breakpoint
-- Custom back-fill (hand-written): keep the history of mail already sent or failed, so the
-- Outgoing mail page shows it. The old log kept no body; those rows are never sent again.
INSERT INTO `mail_outbox` (`id`, `to`, `subject`, `text`, `html`, `template`, `link`, `status`, `attempts`, `send_after`, `last_error`, `sent_at`, `created_at`)
SELECT `id`, `to`, `subject`, '', '', `template`, `link`, `status`, 1, `at`, `error`, CASE WHEN `status` = 'sent' THEN `at` END, `at` FROM `mail_log`;
--> statement-breakpoint
DROP TABLE `mail_log`;