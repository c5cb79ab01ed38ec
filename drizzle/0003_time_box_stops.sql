ALTER TABLE `estimate_lines` ADD `extends_line_id` text;--> statement-breakpoint
ALTER TABLE `estimate_lines` ADD `box_warned_milli` integer;--> statement-breakpoint
ALTER TABLE `estimate_lines` ADD `box_reached_milli` integer;--> statement-breakpoint
ALTER TABLE `time_entries` ADD `stop_at` text;--> statement-breakpoint
ALTER TABLE `time_entries` ADD `stopped_by` text;--> statement-breakpoint
CREATE INDEX `time_entries_running_stop_idx` ON `time_entries` (`ended_at`,`stop_at`);