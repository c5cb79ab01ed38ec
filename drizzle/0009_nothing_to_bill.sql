-- Which visits still wait to be invoiced, kept on the visit (db/queries/billing-state.ts), so the
-- "ready to invoice" and "waiting for a PO" lists read only those instead of every past visit.
-- The back-fill sets the flag from the truth the app keeps it to: a live invoice, or a released
-- visit with no approved, started or finished line.
ALTER TABLE `work_orders` ADD `nothing_to_bill` integer DEFAULT false NOT NULL;--> statement-breakpoint
CREATE INDEX `work_orders_to_bill_number_idx` ON `work_orders` (`number`) WHERE nothing_to_bill = 0;--> statement-breakpoint
UPDATE `work_orders` SET `nothing_to_bill` = (
  EXISTS (SELECT 1 FROM `invoices` i WHERE i.`work_order_id` = `work_orders`.`id` AND i.`status` <> 'void')
  OR (`work_orders`.`status` = 'released'
      AND NOT EXISTS (SELECT 1 FROM `estimate_lines` l WHERE l.`work_order_id` = `work_orders`.`id` AND l.`state` IN ('approved', 'in_progress', 'done')))
);
