import { CAN, hasRole } from "@/lib/auth/policy";
import type { Role } from "@/lib/domain";
import type { NavItem } from "./app-shell";

export function shopNav(role: Role): NavItem[] {
  const items: NavItem[] = [
    { href: "/floor", label: "Floor" },
    { href: "/work-orders", label: "Work orders" },
    { href: "/units", label: "Units" },
  ];
  if (hasRole({ role }, CAN.issueInvoices)) items.push({ href: "/invoices", label: "Invoices" }, { href: "/receivables", label: "Receivables" });
  if (hasRole({ role }, CAN.manageAccounts)) items.push({ href: "/accounts", label: "Accounts" });
  if (role === "owner") items.push({ href: "/settings", label: "Settings" }, { href: "/settings/people", label: "People" }, { href: "/settings/mail", label: "Mail" });
  return items;
}

export function fleetNav(role: Role): NavItem[] {
  const items: NavItem[] = [
    { href: "/fleet", label: "Units" },
    { href: "/fleet/reports", label: "Defect reports" },
    { href: "/fleet/occurrences", label: "Occurrence log" },
  ];
  if (hasRole({ role }, CAN.pay)) items.push({ href: "/fleet/invoices", label: "Invoices" });
  if (hasRole({ role }, CAN.readStatement)) items.push({ href: "/fleet/statement", label: "Statement" });
  return items;
}
