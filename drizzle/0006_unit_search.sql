-- Hand-written (drizzle-kit generate --custom): a trigram full-text index over what people
-- search units by, so "any 4+ characters of a VIN, anywhere in it" is answered from an index
-- instead of a LIKE '%…%' scan. SQLite's FTS5 trigram tokenizer (3.34+) matches any substring
-- of three or more characters, case-insensitively. Triggers keep it in step with units and
-- account names; fields are joined with " | " so no match spans two of them.
CREATE VIRTUAL TABLE `unit_search` USING fts5(`unit_id` UNINDEXED, `body`, tokenize = 'trigram');
--> statement-breakpoint
INSERT INTO `unit_search` (`unit_id`, `body`)
SELECT u.`id`, u.`unit_number` || ' | ' || coalesce(u.`vin`, '') || ' | ' || coalesce(u.`serial_number`, '') || ' | ' || u.`plate` || ' | ' || u.`description` || ' | ' || a.`name`
FROM `units` u JOIN `accounts` a ON a.`id` = u.`account_id`;
--> statement-breakpoint
CREATE TRIGGER `unit_search_after_insert` AFTER INSERT ON `units` BEGIN
  INSERT INTO `unit_search` (`unit_id`, `body`)
  SELECT new.`id`, new.`unit_number` || ' | ' || coalesce(new.`vin`, '') || ' | ' || coalesce(new.`serial_number`, '') || ' | ' || new.`plate` || ' | ' || new.`description` || ' | ' || a.`name`
  FROM `accounts` a WHERE a.`id` = new.`account_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `unit_search_after_update` AFTER UPDATE OF `unit_number`, `vin`, `serial_number`, `plate`, `description`, `account_id` ON `units` BEGIN
  DELETE FROM `unit_search` WHERE `unit_id` = old.`id`;
  INSERT INTO `unit_search` (`unit_id`, `body`)
  SELECT new.`id`, new.`unit_number` || ' | ' || coalesce(new.`vin`, '') || ' | ' || coalesce(new.`serial_number`, '') || ' | ' || new.`plate` || ' | ' || new.`description` || ' | ' || a.`name`
  FROM `accounts` a WHERE a.`id` = new.`account_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `unit_search_after_delete` AFTER DELETE ON `units` BEGIN
  DELETE FROM `unit_search` WHERE `unit_id` = old.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `unit_search_after_account_rename` AFTER UPDATE OF `name` ON `accounts` BEGIN
  DELETE FROM `unit_search` WHERE `unit_id` IN (SELECT `id` FROM `units` WHERE `account_id` = new.`id`);
  INSERT INTO `unit_search` (`unit_id`, `body`)
  SELECT u.`id`, u.`unit_number` || ' | ' || coalesce(u.`vin`, '') || ' | ' || coalesce(u.`serial_number`, '') || ' | ' || u.`plate` || ' | ' || u.`description` || ' | ' || new.`name`
  FROM `units` u WHERE u.`account_id` = new.`id`;
END;
