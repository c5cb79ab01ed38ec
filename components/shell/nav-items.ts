import type { Role } from "@/lib/domain";
import type { NavItem } from "./app-shell";

export function shopNav(role: Role): NavItem[] {
  const items: NavItem[] = [{ href: "/floor", label: "Floor" }];
  return items.filter(Boolean);
}

export function fleetNav(_role: Role): NavItem[] {
  return [{ href: "/fleet", label: "Units" }];
}
