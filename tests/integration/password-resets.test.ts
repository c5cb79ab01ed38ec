import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as changeMine } from "@/app/api/v1/me/password/route";
import { GET as me } from "@/app/api/v1/me/route";
import { POST as complete } from "@/app/api/v1/password-resets/complete/route";
import { POST as requestReset } from "@/app/api/v1/password-resets/route";
import { getDb } from "@/db/client";
import { passwordResets, users } from "@/db/schema";
import { authOptions } from "@/lib/server/auth/options";
import { sha256Hex } from "@/lib/auth/tokens";
import { call, sessionCookie, userByEmail } from "./helpers/app";
import { catchMail } from "./helpers/mail";

const mail = catchMail();

const authorize = (email: string, password: string) =>
  (authOptions().providers[0] as unknown as { options: { authorize: (c: Record<string, string>, r: { headers: Record<string, string> }) => Promise<unknown> } }).options.authorize(
    { email, password },
    { headers: { "x-forwarded-for": "192.0.2.77" } },
  );

async function resetLinkFor(email: string) {
  const m = await mail.smtp().waitFor((x) => x.to.includes(email) && x.subject.includes("password reset"));
  return mail.linkIn(m, "/reset-password");
}

describe("password resets: one hour, once, hashed, and every other session ends", () => {
  it("answers 202 with the same words whether or not the address signs in, and mails only a real one", async () => {
    const known = await call(requestReset, { path: "/api/v1/password-resets", body: { email: "clerk@brennan-twp.example" } });
    const unknown = await call(requestReset, { path: "/api/v1/password-resets", body: { email: "nobody@nowhere.example" } });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    await resetLinkFor("clerk@brennan-twp.example");
    expect((await mail.smtp().messages()).some((m) => m.to.includes("nobody@nowhere.example"))).toBe(false);
  });

  it("the link sets a new password, works once, stores only a hash, and signs the person out everywhere else", async () => {
    const email = "transport@alder-falls-schools.example";
    const oldSession = await sessionCookie(email);
    expect((await call(me, { path: "/api/v1/me", headers: { cookie: oldSession } })).status).toBe(200);

    await call(requestReset, { path: "/api/v1/password-resets", body: { email } });
    const token = await resetLinkFor(email);
    const user = await userByEmail(email);
    const rows = await getDb().select().from(passwordResets).where(eq(passwordResets.userId, user.id));
    expect(rows.map((r) => r.tokenHash)).toContain(sha256Hex(token));
    expect(JSON.stringify(rows)).not.toContain(token);
    // One hour (reference: the "the link lasts one hour").
    const row = rows.find((r) => r.tokenHash === sha256Hex(token))!;
    expect(Date.parse(row.expiresAt) - Date.parse(row.createdAt)).toBe(3_600_000);

    const done = await call(complete, { path: "/api/v1/password-resets/complete", body: { token, password: "a-fresh-school-password" } });
    expect(done.status).toBe(200);
    // The session from before the reset is over; the new password signs in, the old one does not.
    expect((await call(me, { path: "/api/v1/me", headers: { cookie: oldSession } })).status).toBe(401);
    await expect(authorize(email, "a-fresh-school-password")).resolves.toMatchObject({ email });
    await expect(authorize(email, "cotter-demo")).resolves.toBeNull();
    const fresh = await sessionCookie(email);
    expect((await call(me, { path: "/api/v1/me", headers: { cookie: fresh } })).status).toBe(200);

    const again = await call(complete, { path: "/api/v1/password-resets/complete", body: { token, password: "yet-another-password" } });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe("reset_used");
  });

  it("an hour-old link is 410 reset_expired and changes nothing", async () => {
    const email = "office@kettle-ridge.example";
    await call(requestReset, { path: "/api/v1/password-resets", body: { email } });
    const token = await resetLinkFor(email);
    await getDb().update(passwordResets).set({ expiresAt: new Date(Date.now() - 1).toISOString() }).where(eq(passwordResets.tokenHash, sha256Hex(token)));
    const before = (await userByEmail(email)).passwordHash;
    const res = await call(complete, { path: "/api/v1/password-resets/complete", body: { token, password: "too-late-for-a-reset" } });
    expect(res.status).toBe(410);
    expect(res.body.code).toBe("reset_expired");
    expect((await userByEmail(email)).passwordHash).toBe(before);
  });

  it("sends at most three links an hour to one address; bad input is a 400", async () => {
    const email = "trustee@brennan-twp.example";
    await mail.smtp().clear();
    for (let i = 0; i < 5; i += 1) expect((await call(requestReset, { path: "/api/v1/password-resets", body: { email } })).status).toBe(202);
    const user = await userByEmail(email);
    expect(await getDb().select().from(passwordResets).where(eq(passwordResets.userId, user.id))).toHaveLength(3);
    const bad = await call(requestReset, { path: "/api/v1/password-resets", body: { email: "not an address" } });
    expect(bad.status).toBe(400);
    expect(bad.body.errors?.[0]?.path).toBe("email");
    const badToken = await call(complete, { path: "/api/v1/password-resets/complete", body: { token: "abc", password: "long-enough-pass" } });
    expect(badToken.status).toBe(400);
  });

  it("everyone changes their own password with the current one; other sessions end", async () => {
    const email = "foreman@brennan-twp.example";
    const session = await sessionCookie(email);
    const wrong = await call(changeMine, { path: "/api/v1/me/password", headers: { cookie: session }, body: { currentPassword: "not-it", newPassword: "foreman-new-password", confirmPassword: "foreman-new-password" } });
    expect(wrong.status).toBe(400);
    expect(wrong.body.errors?.[0]?.path).toBe("currentPassword");
    const mismatch = await call(changeMine, { path: "/api/v1/me/password", headers: { cookie: session }, body: { currentPassword: "cotter-demo", newPassword: "foreman-new-password", confirmPassword: "different-one-here" } });
    expect(mismatch.status).toBe(400);
    const before = await userByEmail(email);
    expect(before.sessionVersion).toBe(0);
    const ok = await call(changeMine, { path: "/api/v1/me/password", headers: { cookie: session }, body: { currentPassword: "cotter-demo", newPassword: "foreman-new-password", confirmPassword: "foreman-new-password" } });
    expect(ok.status).toBe(200);
    expect((await call(me, { path: "/api/v1/me", headers: { cookie: session } })).status).toBe(401);
    await expect(authorize(email, "foreman-new-password")).resolves.toMatchObject({ email });
    expect((await call(changeMine, { path: "/api/v1/me/password", body: { currentPassword: "x", newPassword: "y".repeat(12), confirmPassword: "y".repeat(12) } })).status).toBe(401);
    const [row] = await getDb().select({ v: users.sessionVersion }).from(users).where(eq(users.email, email));
    expect(row!.v).toBe(1);
  });
});
