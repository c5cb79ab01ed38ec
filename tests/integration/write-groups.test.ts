// writeTx commits together the writes asked for in one turn of the event loop
// and those that queue up behind a running one (db/client.ts): each in its own savepoint, each promise settled after the
// one COMMIT. What each caller is told must be exactly what is on disk.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb, writeTx } from "@/db/client";
import { auditLog } from "@/db/schema";
import type { ProblemCode } from "@/lib/api-schema/problem-codes";
import { conflict } from "@/lib/http/problem";

const mark = (action: string, entityId: string) => ({ at: new Date().toISOString(), actorLabel: "test", action, entityType: "test", entityId });
const kept = async (action: string) => (await getDb().select({ id: auditLog.entityId }).from(auditLog).where(eq(auditLog.action, action))).map((r) => r.id).sort();

describe("writes committed in groups", () => {
  it("keeps every write but a refused one, whose own rows go with it, and answers each after the commit", async () => {
    const seen: string[][] = [];
    const writes = Array.from({ length: 12 }, (_, i) =>
      writeTx(async (tx) => {
        await tx.insert(auditLog).values(mark("group.refusal", `w${String(i).padStart(2, "0")}`));
        if (i === 5) throw conflict("refused_on_purpose" as ProblemCode, "This one is refused."); // a code no route uses, so this refusal cannot be mistaken for another
        return i;
      }).then(
        async (i) => {
          // Told only once it is on disk: a read outside the transaction already sees it.
          seen.push(await kept("group.refusal"));
          return i;
        },
        (e: unknown) => e,
      ),
    );
    const results = await Promise.all(writes);
    expect(results[5]).toMatchObject({ status: 409, code: "refused_on_purpose" });
    expect(results.filter((r) => typeof r === "number")).toHaveLength(11);
    const expected = Array.from({ length: 12 }, (_, i) => `w${String(i).padStart(2, "0")}`).filter((id) => id !== "w05");
    expect(await kept("group.refusal")).toEqual(expected);
    results.forEach((r, i) => {
      if (typeof r === "number") expect(seen.some((ids) => ids.includes(`w${String(i).padStart(2, "0")}`))).toBe(true);
    });
  });

  it("groups the writes that callbacks of one turn of the event loop ask for, as requests arriving together do", async () => {
    // Each write first reads through the pool, which sees only what has committed: in one group none sees another's row.
    const committedBefore: number[] = [];
    const writes = Array.from(
      { length: 5 },
      (_, i) =>
        new Promise<number>((resolve, reject) =>
          setImmediate(() => {
            writeTx(async (tx) => {
              committedBefore.push((await kept("group.turn")).length);
              await tx.insert(auditLog).values(mark("group.turn", `t${i}`));
              return i;
            }).then(resolve, reject);
          }),
        ),
    );
    expect(await Promise.all(writes)).toEqual([0, 1, 2, 3, 4]);
    // Started at once, each would have run to its COMMIT before the next callback: 0, 1, 2, 3, 4.
    expect(committedBefore).toEqual([0, 0, 0, 0, 0]);
    expect(await kept("group.turn")).toEqual(["t0", "t1", "t2", "t3", "t4"]);
  });

  it("fails only the write that broke, and still commits the others of its group exactly once", async () => {
    const runs = new Map<number, number>();
    const writes = Array.from({ length: 10 }, (_, i) =>
      writeTx(async (tx) => {
        runs.set(i, (runs.get(i) ?? 0) + 1);
        await tx.insert(auditLog).values(mark("group.error", `e${i}`));
        if (i === 3) throw new Error("broken on purpose");
        return i;
      }).catch((e: unknown) => e),
    );
    const results = await Promise.all(writes);
    expect(results[3]).toBeInstanceOf(Error);
    expect(results.filter((r) => typeof r === "number")).toHaveLength(9);
    // Each kept write's row is there once, however often its group was tried.
    expect(await kept("group.error")).toEqual([0, 1, 2, 4, 5, 6, 7, 8, 9].map((i) => `e${i}`));
    expect([...runs.values()].every((n) => n >= 1)).toBe(true);
  });
});
