import type { Role } from "@/lib/domain";
import type { NavItem } from "./app-shell";

export function shopNav(_role: Role): NavItem[] {
  return [{ href: "/floor", label: "Floor" }];
}

export function fleetNav(_role: Role): NavItem[] {
  return [
    { href: "/fleet", label: "Units" },
    { href: "/fleet/occurrences", label: "Occurrence log" },
  ];
}
