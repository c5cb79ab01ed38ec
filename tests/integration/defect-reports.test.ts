import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as moveStatus } from "@/app/api/v1/work-orders/[id]/status/route";
import { GET as getWo } from "@/app/api/v1/work-orders/[id]/route";
import { POST as checkIn } from "@/app/api/v1/work-orders/route";
import { GET as listReports } from "@/app/api/v1/service-requests/route";
import { POST as report } from "@/app/api/v1/units/[id]/service-requests/route";
import { getDb } from "@/db/client";
import { takeUnattachedPhotos } from "@/db/queries/photo-sweep";
import { photos, serviceRequests, units } from "@/db/schema";
import { DVIR_AREAS } from "@/lib/service-requests";
import { call, userByEmail } from "./helpers/app";
import { catchMail } from "./helpers/mail";

const mail = catchMail();
const FOREMAN = "foreman@brennan-twp.example";
const WRITER = "writer@quarry-road.example";

async function unit(number: string) {
  const [u] = await getDb().select().from(units).where(eq(units.unitNumber, number));
  return u!;
}

type Report = { id: string; status: string; unitId: string; unitNumber: string; reporterName: string; workOrderId: string | null; workOrderLabel: string | null; defects: { area: string; description: string; outOfService: boolean }[] };

describe("defect reports from the fleet, in the shape of a driver's inspection report (49 CFR 396.11)", () => {
  let reportId = "";

  it("a foreman reports defects on a unit: who, which unit, what is wrong and whether it is out of service; the shop is e-mailed", async () => {
    const t5 = await unit("T-5");
    const res = await call<Report>(report, {
      path: `/api/v1/units/${t5.id}/service-requests`,
      as: FOREMAN,
      params: { id: t5.id },
      body: {
        defects: [
          { area: "Service brakes and trailer brake connections", description: "Air leak hissing at the rear axle with brakes applied.", outOfService: true },
          { area: "Lights and reflectors", description: "Right rear marker lamp out." },
        ],
        odometer: 97_900,
        note: "Parked in bay 2 at the township garage.",
      },
    });
    expect(res.status).toBe(201);
    reportId = res.body.id;
    // 396.11: the report identifies the vehicle and the driver.
    expect(res.body).toMatchObject({ status: "open", unitId: t5.id, reporterName: (await userByEmail(FOREMAN)).name });
    const m = await mail.smtp().waitFor((x) => x.to.includes("writer@quarry-road.example") && x.subject.includes("defect report on T-5"));
    expect(m.subject).toMatch(/^Out of service: /);
    expect(m.text).toContain("Air leak hissing at the rear axle");
  });

  it("lists in scope: the shop sees every account's open reports, a fleet person their own account's", async () => {
    const shop = await call<{ serviceRequests: Report[] }>(listReports, { path: "/api/v1/service-requests?status=open", as: WRITER });
    expect(shop.body.serviceRequests.map((r) => r.id)).toContain(reportId);
    const own = await call<{ serviceRequests: Report[] }>(listReports, { path: "/api/v1/service-requests", as: "clerk@brennan-twp.example" });
    expect(own.body.serviceRequests.map((r) => r.id)).toContain(reportId);
    const other = await call<{ serviceRequests: Report[] }>(listReports, { path: "/api/v1/service-requests", as: "office@kettle-ridge.example" });
    expect(other.body.serviceRequests).toEqual([]);
    expect((await call(listReports, { path: "/api/v1/service-requests?status=lost", as: WRITER })).status).toBe(400);
  });

  it("another account's unit is 404; bad input is a 400 and writes nothing", async () => {
    const haul7 = await unit("Haul 7");
    expect((await call(report, { path: `/api/v1/units/${haul7.id}/service-requests`, as: FOREMAN, params: { id: haul7.id }, body: { defects: [{ description: "x" }] } })).status).toBe(404);
    const t5 = await unit("T-5");
    const before = (await getDb().select().from(serviceRequests)).length;
    const cases: [unknown, string][] = [
      [{ defects: [] }, "defects"],
      [{ defects: [{ description: "" }] }, "defects.0.description"],
      [{ defects: [{ description: "x", area: "Flux capacitor" }] }, "defects.0.area"],
      [{ defects: [{ description: "x" }], odometer: -5 }, "odometer"],
      [{ defects: [{ description: "x" }], photoId: "not-mine" }, "photoId"],
    ];
    for (const [body, field] of cases) {
      const res = await call(report, { path: `/api/v1/units/${t5.id}/service-requests`, as: FOREMAN, params: { id: t5.id }, body });
      expect(res.status, field).toBe(400);
      expect(res.body.errors?.map((e) => e.path), field).toContain(field);
    }
    expect((await getDb().select().from(serviceRequests)).length).toBe(before);
    expect((await call(report, { path: `/api/v1/units/${t5.id}/service-requests`, params: { id: t5.id }, body: { defects: [{ description: "x" }] } })).status).toBe(401);
  });

  it("checking the unit in from the report turns its defects into the visit's concerns; the reporter sees it scheduled, then fixed", async () => {
    const t5 = await unit("T-5");
    const res = await call<{ id: string; concerns: { complaint: string }[] }>(checkIn, { path: "/api/v1/work-orders", as: WRITER, body: { unitId: t5.id, serviceRequestId: reportId } });
    expect(res.status).toBe(201);
    const foreman = (await userByEmail(FOREMAN)).name;
    expect(res.body.concerns.map((c) => c.complaint)).toEqual([
      `Service brakes and trailer brake connections: Air leak hissing at the rear axle with brakes applied. (reported by ${foreman}, out of service)`,
      `Lights and reflectors: Right rear marker lamp out. (reported by ${foreman})`,
    ]);
    const scheduled = await call<{ serviceRequests: Report[] }>(listReports, { path: "/api/v1/service-requests", as: FOREMAN });
    expect(scheduled.body.serviceRequests.find((r) => r.id === reportId)).toMatchObject({ status: "scheduled", workOrderId: res.body.id });
    await mail.smtp().waitFor((x) => x.to.includes(FOREMAN) && x.subject.includes("is checked in"));
    // A report goes onto one visit only.
    const again = await call(checkIn, { path: "/api/v1/work-orders", as: WRITER, body: { unitId: (await unit("Water 1")).id, serviceRequestId: reportId } });
    expect(again.status).toBe(400);

    await call(moveStatus, { path: `/api/v1/work-orders/${res.body.id}/status`, as: WRITER, params: { id: res.body.id }, body: { status: "ready", note: "Leak fixed, lamp replaced." } });
    const fixed = await call<{ serviceRequests: Report[] }>(listReports, { path: "/api/v1/service-requests?status=closed", as: FOREMAN });
    expect(fixed.body.serviceRequests.map((r) => r.id)).toContain(reportId);
    await mail.smtp().waitFor((x) => x.to.includes(FOREMAN) && x.subject.includes("are fixed"));
    const view = await call<{ concerns: unknown[] }>(getWo, { path: `/api/v1/work-orders/${res.body.id}`, as: FOREMAN, params: { id: res.body.id } });
    expect(view.body.concerns).toHaveLength(2);
  });

  it("carries the reporter's own fresh photo of the unit, and no one else's; the sweep of unattached photos leaves it", async () => {
    const t5 = await unit("T-5");
    const foreman = await userByEmail(FOREMAN);
    const supervisor = await userByEmail("supervisor@brennan-twp.example");
    // As the upload route leaves a photo taken for a unit before the report is sent: the uploader's, on no visit yet.
    const fresh = (uploadedBy: string, createdAt = new Date().toISOString()) => ({ accountId: t5.accountId, unitId: t5.id, uploadedBy, fileKey: `k-${Math.random()}`, fileUrl: "http://uploads.invalid/x", mime: "image/jpeg", createdAt });
    const [mine] = await getDb().insert(photos).values(fresh(foreman.id, "2020-01-01T00:00:00.000Z")).returning();
    const [theirs] = await getDb().insert(photos).values(fresh(supervisor.id)).returning();
    const refused = await call(report, { path: `/api/v1/units/${t5.id}/service-requests`, as: FOREMAN, params: { id: t5.id }, body: { defects: [{ description: "Cracked windshield" }], photoId: theirs!.id } });
    expect(refused.status).toBe(400);
    const res = await call<Report>(report, { path: `/api/v1/units/${t5.id}/service-requests`, as: FOREMAN, params: { id: t5.id }, body: { defects: [{ area: "Windshield wipers", description: "Wiper blade torn" }], photoId: mine!.id } });
    expect(res.status).toBe(201);
    const listed = await call<{ serviceRequests: (Report & { photos: { url: string }[] })[] }>(listReports, { path: "/api/v1/service-requests?status=open", as: WRITER });
    expect(listed.body.serviceRequests.find((r) => r.id === res.body.id)!.photos).toEqual([{ url: `/api/v1/photos/${mine!.id}`, thumbUrl: `/api/v1/photos/${mine!.id}/thumb` }]);
    // A week-old unattached photo is swept; one on a report stays.
    const swept = await takeUnattachedPhotos(new Date().toISOString(), 100);
    expect(swept.map((p) => p.id)).not.toContain(mine!.id);
  });

  it("names the parts a driver's report covers, 49 CFR 396.11(a)(1)(i)–(xi) (from memory for the exact wording)", () => {
    expect(DVIR_AREAS).toHaveLength(11);
    expect(DVIR_AREAS[0]).toMatch(/brake/i);
    expect(DVIR_AREAS).toContain("Emergency equipment");
  });
});
