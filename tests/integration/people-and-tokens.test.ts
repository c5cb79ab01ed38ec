import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as me } from "@/app/api/v1/me/route";
import { createToken, listMyTokens, revokeToken } from "@/db/queries/api-tokens";
import { acceptInvitation, createInvitation } from "@/db/queries/invitations";
import { setPersonActive } from "@/db/queries/people";
import { getDb } from "@/db/client";
import { apiTokens, accounts } from "@/db/schema";
import { authOptions } from "@/lib/server/auth/options";
import { call, sessionUser } from "./helpers/app";

const authorize = (email: string, password: string) =>
  (authOptions().providers[0] as unknown as { options: { authorize: (c: Record<string, string>, r: { headers: Record<string, string> }) => Promise<unknown> } }).options.authorize(
    { email, password },
    { headers: { "x-forwarded-for": "192.0.2.50" } },
  );

describe("people and personal API tokens", () => {
  it("an approver the owner invited sets their own password and can then sign in; the same e-mail cannot be invited twice", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const [kettle] = await getDb().select().from(accounts).where(eq(accounts.name, "Kettle Ridge Stone Co."));
    const { token } = await createInvitation(owner, { name: "Dee Marsh", email: "dee@kettle-ridge.example", role: "approver", accountId: kettle!.id, signingLimitCents: 150_000 });
    await acceptInvitation(token, "a-long-first-password");
    await expect(authorize("dee@kettle-ridge.example", "a-long-first-password")).resolves.toMatchObject({ role: "approver", accountId: kettle!.id });
    await expect(createInvitation(owner, { name: "Again", email: "dee@kettle-ridge.example", role: "viewer", accountId: kettle!.id })).rejects.toMatchObject({ status: 400 });
  });

  it("turning sign-in off ends the person's session and tokens at their next request", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const foreman = await sessionUser("foreman@brennan-twp.example");
    const { token } = await createToken(foreman, "phone script");
    expect((await call(me, { path: "/api/v1/me", headers: { authorization: `Bearer ${token}` } })).status).toBe(200);
    expect((await call(me, { path: "/api/v1/me", as: "foreman@brennan-twp.example" })).status).toBe(200);
    await setPersonActive(owner, foreman.id, false);
    expect((await call(me, { path: "/api/v1/me", as: "foreman@brennan-twp.example" })).status).toBe(401);
    expect((await call(me, { path: "/api/v1/me", headers: { authorization: `Bearer ${token}` } })).status).toBe(401);
    await setPersonActive(owner, foreman.id, true);
    await expect(setPersonActive(owner, owner.id, false)).rejects.toMatchObject({ code: "cannot_deactivate_self" });
  });

  it("stores only a hash of a token, lists it without the secret, and revokes it", async () => {
    const clerk = await sessionUser("clerk@brennan-twp.example");
    const { token, prefix } = await createToken(clerk, "accounting export");
    const stored = await getDb().select().from(apiTokens).where(eq(apiTokens.prefix, prefix));
    expect(stored[0]!.tokenHash).not.toContain(token);
    expect(JSON.stringify(await listMyTokens(clerk))).not.toContain(token);
    const row = (await listMyTokens(clerk)).find((t) => t.prefix === prefix)!;
    await revokeToken(clerk, row.id);
    expect((await call(me, { path: "/api/v1/me", headers: { authorization: `Bearer ${token}` } })).status).toBe(401);
    // Someone else's token id is not found.
    await expect(revokeToken(await sessionUser("supervisor@brennan-twp.example"), row.id)).rejects.toMatchObject({ status: 404 });
  });
});
