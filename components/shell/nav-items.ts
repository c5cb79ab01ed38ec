import type { Role } from "@/lib/domain";
import type { NavItem } from "./app-shell";

export function shopNav(role: Role): NavItem[] {
  const items: NavItem[] = [{ href: "/floor", label: "Floor" }];
  if (role === "owner" || role === "writer") items.push({ href: "/accounts", label: "Accounts" });
  if (role === "owner") items.push({ href: "/settings", label: "Settings" }, { href: "/settings/people", label: "People" }, { href: "/dev/mail", label: "Mail" });
  return items;
}

export function fleetNav(_role: Role): NavItem[] {
  return [
    { href: "/fleet", label: "Units" },
    { href: "/fleet/occurrences", label: "Occurrence log" },
  ];
}
