import { ROLE_LABELS, type Role } from "@/lib/domain";

/** The technician picker's choices: nobody yet, then staff (a writer or owner who wrenches says so). */
export function staffOptions(staff: { id: string; name: string; role: string }[], none: string): (readonly [string, string])[] {
  return [["", none], ...staff.map((s) => [s.id, s.role === "tech" ? s.name : `${s.name} (${ROLE_LABELS[s.role as Role] ?? s.role})`] as const)];
}
