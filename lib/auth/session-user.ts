import type { Role } from "@/lib/domain";

/** Who is asking: loaded fresh from the database on every request, never trusted from the cookie alone. */
export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
  accountId: string | null;
  signingLimitCents: number | null;
  via: "session" | "token";
}
