import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as oneFinding } from "@/app/api/v1/findings/[id]/route";
import { GET as listFindings, POST as postFinding } from "@/app/api/v1/work-orders/[id]/findings/route";
import { getDb } from "@/db/client";
import { estimateLines, findingReadings, findings, workOrders } from "@/db/schema";
import { call } from "./helpers/app";
import { workOrderByNumber } from "./helpers/work-orders";

interface FindingBody {
  id: string;
  title: string;
  severity: string;
  noteMarkdown: string;
  photos: { url: string; thumbUrl: string }[];
  readings: { kind: string; location: string; value: number; unit: string; verdict: string; limit: string; source: string }[];
  proposedLineIds: string[];
  code?: string;
  errors?: { path: string; message: string }[];
}

const post = (id: string, as: string | null, body: unknown) =>
  call<FindingBody>(postFinding, { path: `/api/v1/work-orders/${id}/findings`, params: { id }, as, body });

describe("POST /api/v1/work-orders/:id/findings: readings are checked on the server", () => {
  it("works out every verdict itself from the typed input, ignoring a verdict sent by the phone", async () => {
    const wo = await workOrderByNumber(1044);
    const res = await post(wo.id, "tech2@quarry-road.example", {
      title: "Right rear brake stroke past the readjustment limit",
      severity: "out_of_service",
      noteMarkdown: "Slack adjuster **not adjusting**.\n\n- Left rear 1¾ in\n- Right rear 2¼ in",
      readings: [
        // 49 CFR 393.47(e)(1): type 30 standard stroke, limit 2 in; 2¼ in is beyond it, whatever the phone says.
        { kind: "brake_stroke", location: "Axle 2 right", chamberType: 30, strokeClass: "standard", value: 2.25, verdict: "within" },
        // 49 CFR 393.47(e)(1): a stroke exactly at the limit does not exceed it.
        { kind: "brake_stroke", location: "Axle 2 left", chamberType: 30, strokeClass: "standard", value: 2 },
        // 49 CFR 393.75(b): steering-axle tyres at least 4/32 in.
        { kind: "tread_depth", location: "Steer left", position: "steer", value: 5, unit: "32nds" },
      ],
      proposedLines: [
        { description: "Replace right rear slack adjuster", kind: "part", quantity: 1 },
        { description: "Adjust brakes, all wheel ends", kind: "labor", quantity: 1.5 },
      ],
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ title: "Right rear brake stroke past the readjustment limit", severity: "out_of_service", photos: [] });
    expect(res.body.readings).toEqual([
      expect.objectContaining({ kind: "brake_stroke", location: "Axle 2 right", value: 2.25, unit: "in", verdict: "beyond", limit: "≤ 2 in (type 30, standard stroke)", source: "49 CFR 393.47(e)(1)" }),
      expect.objectContaining({ kind: "brake_stroke", location: "Axle 2 left", value: 2, verdict: "at_limit" }),
      expect.objectContaining({ kind: "tread_depth", verdict: "within", source: "49 CFR 393.75(b)" }),
    ]);

    // Proposed lines wait as drafts on the estimate, tied to the finding, for the writer to price.
    const lines = await getDb().select().from(estimateLines).where(eq(estimateLines.findingId, res.body.id));
    expect(lines).toHaveLength(2);
    expect(lines.map((l) => [l.kind, l.description, l.quantityMilli, l.state])).toEqual([
      ["part", "Replace right rear slack adjuster", 1000, "draft"],
      ["labor", "Adjust brakes, all wheel ends", 1500, "draft"],
    ]);
    expect(res.body.proposedLineIds.sort()).toEqual(lines.map((l) => l.id).sort());
  });

  it("uses the unit's own key-off drain figure when the technician types none (common practice: per-unit limit)", async () => {
    const wo = await workOrderByNumber(1043); // T-9, whose accepted drain is 120 mA in the demo data
    const res = await post(wo.id, "tech@quarry-road.example", {
      title: "Key-off drain after the modules slept",
      severity: "fix_now",
      readings: [{ kind: "key_off_drain", value: 180, minutesAfterKeyOff: 60 }],
    });
    expect(res.status).toBe(201);
    expect(res.body.readings[0]).toMatchObject({ verdict: "beyond", unit: "mA" });
    expect(res.body.readings[0]?.limit).toContain("this unit's figure, 120 mA");
  });

  it("refuses a reading that cannot be checked, naming it, and writes nothing", async () => {
    const wo = await workOrderByNumber(1044);
    const before = await getDb().select().from(findings);
    const res = await post(wo.id, "tech2@quarry-road.example", {
      title: "Odd chamber",
      severity: "plan",
      readings: [
        { kind: "tread_depth", position: "other", value: 6, unit: "32nds" },
        { kind: "brake_stroke", chamberType: "other", strokeClass: "standard", value: 1.5 },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe("invalid_input");
    expect(res.body.errors?.[0]).toMatchObject({ path: "readings.1" });
    expect(res.body.errors?.[0]?.message).toMatch(/rated stroke/);
    const wrongType = await post(wo.id, "tech2@quarry-road.example", {
      title: "Bad input",
      severity: "note",
      readings: [{ kind: "brake_stroke", chamberType: 31, strokeClass: "standard", value: "a lot" }],
    });
    expect(wrongType.status).toBe(400);
    expect((await getDb().select().from(findings)).length).toBe(before.length);
  });

  it("refuses a fleet user (403), photos that are not the technician's uploads (400) and a closed visit (409)", async () => {
    const wo = await workOrderByNumber(1042);
    const finding = { title: "Leaking hub seal", severity: "plan" };
    expect((await post(wo.id, "supervisor@brennan-twp.example", finding)).status).toBe(403);
    const photos = await post(wo.id, "tech@quarry-road.example", { ...finding, photoIds: ["not-a-photo-of-mine"] });
    expect(photos.status).toBe(400);
    expect(photos.body.errors?.[0]?.path).toBe("photoIds");
    const labour = await post(wo.id, "tech@quarry-road.example", { ...finding, proposedLines: [{ description: "Reseal", kind: "labor", quantity: 1.25 }] });
    expect(labour.status).toBe(400);
    expect(labour.body.errors?.[0]?.message).toMatch(/tenths of an hour/);

    const [released] = await getDb().select().from(workOrders).where(eq(workOrders.status, "released")).limit(1);
    const closed = await post(released!.id, "tech@quarry-road.example", finding);
    expect(closed.status).toBe(409);
    expect(closed.body.code).toBe("work_order_closed");
  });
});

describe("reading findings back: Out of service first, and only within the account", () => {
  it("lists Out of service before the rest for the fleet, and 404s another account's finding and work order", async () => {
    const wo = await workOrderByNumber(1044);
    await post(wo.id, "tech2@quarry-road.example", { title: "Wiper blades streaking", severity: "note" });
    const own = await call<{ findings: FindingBody[] }>(listFindings, {
      path: `/api/v1/work-orders/${wo.id}/findings`,
      params: { id: wo.id },
      as: "transport@alder-falls-schools.example",
    });
    expect(own.status).toBe(200);
    const severities = own.body.findings.map((f) => f.severity);
    expect(severities[0]).toBe("out_of_service");
    expect(severities).toContain("note");

    const first = own.body.findings[0]!;
    const other = "supervisor@brennan-twp.example";
    expect((await call(oneFinding, { path: `/api/v1/findings/${first.id}`, params: { id: first.id }, as: other })).status).toBe(404);
    expect((await call(listFindings, { path: `/api/v1/work-orders/${wo.id}/findings`, params: { id: wo.id }, as: other })).status).toBe(404);
    const mine = await call<FindingBody>(oneFinding, { path: `/api/v1/findings/${first.id}`, params: { id: first.id }, as: "transport@alder-falls-schools.example" });
    expect(mine.status).toBe(200);
    expect(mine.body.readings.length).toBeGreaterThan(0);
    const stored = await getDb().select().from(findingReadings).where(eq(findingReadings.findingId, first.id));
    expect(stored.every((r) => r.source.length > 0)).toBe(true);
  });
});
