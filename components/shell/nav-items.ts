import { CAN, hasRole } from "@/lib/auth/policy";
import type { Role } from "@/lib/domain";
import type { NavItem } from "./app-shell";

export function shopNav(role: Role): NavItem[] {
  return [
    { href: "/floor", label: "Floor" },
    ...(hasRole({ role }, CAN.issueInvoices)
      ? [
          { href: "/invoices", label: "Invoices" },
          { href: "/receivables", label: "Receivables" },
        ]
      : []),
  ];
}

export function fleetNav(role: Role): NavItem[] {
  return [
    { href: "/fleet", label: "Units", activeUnder: ["/fleet/units"] },
    ...(hasRole({ role }, CAN.pay) ? [{ href: "/fleet/invoices", label: "Invoices" }] : []),
    ...(hasRole({ role }, CAN.readStatement) ? [{ href: "/fleet/statement", label: "Statement" }] : []),
  ];
}
