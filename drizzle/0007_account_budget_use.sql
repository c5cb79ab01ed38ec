CREATE TABLE `account_budget_use` (
	`account_id` text NOT NULL,
	`from_at` text NOT NULL,
	`to_at` text NOT NULL,
	`fiscal_year` text NOT NULL,
	`used_cents` integer DEFAULT 0 NOT NULL,
	PRIMARY KEY(`account_id`, `from_at`, `to_at`),
	FOREIGN KEY (`account_id`) REFERENCES `accounts`(`id`) ON UPDATE no action ON DELETE cascade
);

-- No back-fill here on purpose: a fiscal year's bounds come from the account's start month and the
-- shop's time zone (APP_TIME_ZONE), which SQL cannot turn into instants. The first read of a fiscal
-- year inside a write transaction makes its row from a full recount (db/queries/budget-use.ts), so an
-- existing database has the right totals from its first decision on, and reads before that recount.
