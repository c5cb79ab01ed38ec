import { createClient } from "@libsql/client";
import { encode } from "next-auth/jwt";
import { SECRET } from "./server";

export const PEOPLE = {
  supervisor: "supervisor@brennan-twp.example",
  trustee: "trustee@brennan-twp.example",
  clerk: "clerk@brennan-twp.example",
  writer: "writer@quarry-road.example",
} as const;
export type Person = keyof typeof PEOPLE;

/** A real next-auth session cookie (the JWT the credentials sign-in would set), signed with the server's secret. */
export async function sessionCookie(user: { id: string; name: string; email: string; role: string; accountId: string | null }): Promise<string> {
  const token = await encode({ token: { sub: user.id, name: user.name, email: user.email, role: user.role, accountId: user.accountId }, secret: SECRET });
  return `next-auth.session-token=${token}`;
}

export interface Fixtures {
  cookies: Record<Person, string>;
  /** Session cookies by user id, for the approvers of the approval pool. */
  cookieOf: Map<string, string>;
  w1042: string;
  bigVisit: string;
}

/** The people and visits the benchmark uses, read from one database file. */
export async function readFixtures(dbFile: string): Promise<Fixtures> {
  const client = createClient({ url: `file:${dbFile}`, concurrency: 1 });
  try {
    const users = await client.execute("SELECT id, name, email, role, account_id FROM users WHERE role = 'approver' OR email IN (?, ?)", [PEOPLE.clerk, PEOPLE.writer]);
    const cookieOf = new Map<string, string>();
    const byEmail = new Map<string, string>();
    for (const r of users.rows) {
      const cookie = await sessionCookie({ id: String(r.id), name: String(r.name), email: String(r.email), role: String(r.role), accountId: r.account_id === null ? null : String(r.account_id) });
      cookieOf.set(String(r.id), cookie);
      byEmail.set(String(r.email), cookie);
    }
    const cookies = Object.fromEntries(
      Object.entries(PEOPLE).map(([key, email]) => {
        const cookie = byEmail.get(email);
        if (!cookie) throw new Error(`${dbFile} has no ${email}`);
        return [key, cookie];
      }),
    ) as Record<Person, string>;
    const one = async (sql: string) => {
      const r = await client.execute(sql);
      if (!r.rows[0]) throw new Error(`${dbFile}: nothing for ${sql}`);
      return String(r.rows[0].id);
    };
    return {
      cookies,
      cookieOf,
      w1042: await one("SELECT id FROM work_orders WHERE number = 1042"),
      bigVisit: await one("SELECT w.id FROM work_orders w JOIN estimate_lines l ON l.work_order_id = w.id GROUP BY w.id HAVING count(*) = 250"),
    };
  } finally {
    client.close();
  }
}

/** How many of these lines the database holds approved, and how many approve decisions they have. */
export async function countApproved(dbFile: string, lineIds: string[]): Promise<{ lines: number; decisions: number }> {
  const client = createClient({ url: `file:${dbFile}`, concurrency: 1 });
  try {
    const ids = JSON.stringify(lineIds);
    const lines = await client.execute({ sql: "SELECT count(*) AS n FROM estimate_lines WHERE state = 'approved' AND id IN (SELECT value FROM json_each(?))", args: [ids] });
    const decisions = await client.execute({ sql: "SELECT count(*) AS n FROM decisions WHERE decision = 'approve' AND line_id IN (SELECT value FROM json_each(?))", args: [ids] });
    return { lines: Number(lines.rows[0]?.n ?? 0), decisions: Number(decisions.rows[0]?.n ?? 0) };
  } finally {
    client.close();
  }
}
