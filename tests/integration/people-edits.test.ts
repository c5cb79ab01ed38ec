import { and, desc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as me } from "@/app/api/v1/me/route";
import { getDb } from "@/db/client";
import { setPersonActive, updatePerson } from "@/db/queries/people";
import { auditLog, users } from "@/db/schema";
import { describeChange } from "@/lib/audit-format";
import { call, sessionUser, userByEmail } from "./helpers/app";

describe("the owner edits people: name, role on the same side, signing limit, sign-in on and off", () => {
  it("changes a fleet approver's name and limit, audited on their account in words", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const approver = await userByEmail("transport@alder-falls-schools.example");
    const result = await updatePerson(owner, { userId: approver.id, name: "Jordan Kale-Price", role: "approver", signingLimit: 300_000 });
    expect(result.changed).toBe(2);
    const [row] = await getDb().select().from(users).where(eq(users.id, approver.id));
    expect(row).toMatchObject({ name: "Jordan Kale-Price", signingLimitCents: 300_000 });
    const [audit] = await getDb().select().from(auditLog).where(and(eq(auditLog.accountId, approver.accountId!), eq(auditLog.action, "person.edited"))).orderBy(desc(auditLog.at)).limit(1);
    expect(describeChange(audit!.detail)).toEqual([`${approver.name}: Name: ${approver.name} → Jordan Kale-Price`, `${approver.name}: Signing limit: $2,500.00 → $3,000.00`]);
    // The new role takes effect at the person's next request: sessions are checked against the row.
    const res = await call<{ name: string }>(me, { path: "/api/v1/me", as: "transport@alder-falls-schools.example" });
    expect(res.body.name).toBe("Jordan Kale-Price");
  });

  it("a role stays on its side, and the owner cannot change their own role; refusals change nothing", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const clerk = await userByEmail("clerk@brennan-twp.example");
    await expect(updatePerson(owner, { userId: clerk.id, name: clerk.name, role: "tech", signingLimit: undefined })).rejects.toMatchObject({ status: 400 });
    await expect(updatePerson(owner, { userId: owner.id, name: owner.name, role: "writer", signingLimit: undefined })).rejects.toMatchObject({ status: 400 });
    await expect(updatePerson(owner, { userId: "nope", name: "x", role: "viewer", signingLimit: undefined })).rejects.toMatchObject({ status: 404 });
    const tech = await userByEmail("tech2@quarry-road.example");
    expect((await updatePerson(owner, { userId: tech.id, name: tech.name, role: "writer", signingLimit: undefined })).changed).toBe(1);
    const [after] = await getDb().select({ role: users.role }).from(users).where(eq(users.id, clerk.id));
    expect(after!.role).toBe("clerk");
  });

  it("turning sign-in off is audited with the person's name", async () => {
    const owner = await sessionUser("owner@quarry-road.example");
    const viewer = await userByEmail("foreman@brennan-twp.example");
    await setPersonActive(owner, viewer.id, false);
    const [audit] = await getDb().select().from(auditLog).where(eq(auditLog.action, "person.deactivated")).orderBy(desc(auditLog.at)).limit(1);
    expect(describeChange(audit!.detail)).toEqual([`${viewer.name}: Signs in: yes → no`]);
    await setPersonActive(owner, viewer.id, true);
  });
});
