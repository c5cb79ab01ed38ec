import { describe, expect, it } from "vitest";
import { draftFieldOf, draftHasContent, draftToBody, emptyDraft, parseTyped, restoreDraft, toggleSign } from "@/lib/occurrences/draft";
import { t9NoStart } from "@/db/seed/occurrences";
import { summarizePattern } from "@/lib/occurrences/pattern";
import { celsiusFromFahrenheit } from "@/lib/occurrences/temperature";
import { makeOccurrenceInput } from "@/lib/validation/occurrence";

const NOW = Date.parse("2026-01-12T12:30:00Z");
const utcLocal = (v: string) => Date.parse(`${v}:00Z`);

describe("typed numbers as phones send them (common practice: keypads without a minus key, decimal commas)", () => {
  it.each([
    ["12", 12],
    ["−7", -7],
    ["-7", -7],
    ["–4.5", -4.5],
    ["12,5", 12.5],
    [" 11.8 ", 11.8],
    [".5", 0.5],
    ["", null],
  ])("%j reads as %s", (text, value) => {
    expect(parseTyped(text)).toBe(value);
  });

  it.each(["abc", "1.2.3", "−", "12 V", "1e3"])("%j is not a number", (text) => {
    expect(parseTyped(text)).toBeNaN();
  });

  it("the ± button flips the sign of what is typed, even before any digit", () => {
    expect(toggleSign("")).toBe("−");
    expect(toggleSign("7")).toBe("−7");
    expect(toggleSign("−7")).toBe("7");
    expect(toggleSign("-7")).toBe("7");
  });
});

describe("draft → API body", () => {
  it("sends °F as ambientF (the server converts exactly), times as UTC, and leaves out what was not given", () => {
    const d = { ...emptyDraft("c1", "F" as const), symptom: "no_start" as const, hoursParked: "13", temperature: "−7", batteryVolts: "11,8", recovered: "no" as const };
    const r = draftToBody(d, NOW);
    expect(r).toEqual({ ok: true, body: { occurredAt: "2026-01-12T12:30:00.000Z", symptom: "no_start", hoursParked: 13, ambientF: -7, batteryVolts: 11.8, recovered: false, concernId: "c1" } });
  });

  it("sends °C as ambientC, and an earlier time as typed in the phone's zone", () => {
    const d = { ...emptyDraft(null, "C" as const), when: "2026-01-11T06:05", symptom: "stalled" as const, temperature: "-21.5", note: "  cold  " };
    const r = draftToBody(d, NOW, utcLocal);
    expect(r).toEqual({ ok: true, body: { occurredAt: "2026-01-11T06:05:00.000Z", symptom: "stalled", ambientC: -21.5, note: "cold" } });
  });

  it("says which answers cannot be read, and that a symptom is needed", () => {
    const d = { ...emptyDraft(null, "F" as const), hoursParked: "all night", temperature: "cold", batteryVolts: "12 V" };
    const r = draftToBody(d, NOW);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.errors).sort()).toEqual(["batteryVolts", "hoursParked", "symptom", "temperature"]);
  });

  it("the body passes the same schema the server uses; out-of-range values fail it with the API's paths", () => {
    const schema = makeOccurrenceInput(() => NOW);
    const ok = draftToBody({ ...emptyDraft(null, "F"), symptom: "no_start", temperature: "−76" }, NOW);
    expect(ok.ok && schema.safeParse(ok.body).success).toBe(true);
    const parsed = ok.ok ? schema.parse(ok.body) : null;
    // NIST SP 811 App. B: −76 °F is exactly −60 °C, the lowest value the API accepts.
    expect(parsed?.ambientC).toBe(-60);
    const cold = draftToBody({ ...emptyDraft(null, "F"), symptom: "no_start", temperature: "−77" }, NOW);
    const result = cold.ok ? schema.safeParse(cold.body) : null;
    expect(result?.success).toBe(false);
    expect(result?.error?.issues.map((i) => draftFieldOf(String(i.path[0])))).toEqual(["temperature"]);
  });

  it("a draft with only 'now' and the unit chosen has nothing worth keeping", () => {
    expect(draftHasContent(emptyDraft("c", "C"))).toBe(false);
    expect(draftHasContent({ ...emptyDraft("c", "C"), note: "x" })).toBe(true);
    expect(draftHasContent({ ...emptyDraft("c", "C"), when: "2026-01-11T06:05" })).toBe(true);
  });
});

describe("the entry's photo in the draft (issue 6: an optional photo, kept with the draft)", () => {
  const photo = { photoId: "p1", name: "dash.jpg", url: "/api/v1/photos/p1", thumbUrl: "/api/v1/photos/p1/thumb" };

  it("sends only the uploaded photo's id, which the server schema accepts; its errors come back to the photo", () => {
    const r = draftToBody({ ...emptyDraft(null, "C"), symptom: "no_start", photo }, NOW);
    expect(r).toEqual({ ok: true, body: { occurredAt: "2026-01-12T12:30:00.000Z", symptom: "no_start", photoId: "p1" } });
    expect(r.ok && makeOccurrenceInput(() => NOW).parse(r.body).photoId).toBe("p1");
    expect(draftFieldOf("photoId")).toBe("photo");
  });

  it("a photo alone is worth keeping; a draft kept before photos existed comes back without one", () => {
    expect(draftHasContent({ ...emptyDraft("c", "C"), photo })).toBe(true);
    const { photo: _none, ...older } = { ...emptyDraft("c", "F"), note: "kept" };
    const restored = restoreDraft(older, emptyDraft(null, "C"));
    expect(restored).toMatchObject({ note: "kept", unit: "F", concernId: "c", photo: null });
    expect(draftHasContent(restored)).toBe(true);
  });
});

describe("the demo season reads as the pattern it was written to show", () => {
  const pointsAt = (now: number) =>
    t9NoStart({ now: new Date(now), ids: new Map(), milestones: new Map(), db: null as never }).map((o) => ({
      occurredAt: new Date(now - o.daysAgo * 86_400_000).toISOString(),
      hoursParked: o.hoursParked,
      ambientC: o.tempF === null ? null : celsiusFromFahrenheit(o.tempF),
      batteryVolts: o.volts,
      recovered: o.recovered,
    }));

  it("T-9 in January: the soaks and a cold season's mornings (temperatures follow the demo town's season)", () => {
    expect(summarizePattern(pointsAt(NOW), { now: NOW }).headline).toBe("14 of 15 after more than 10 h parked, 12 of 15 below 30 °F");
  });

  it("T-9 in July: the same soaks, summer mornings — no cold-weather pattern claimed", () => {
    const july = Date.parse("2026-07-20T12:30:00Z");
    const summary = summarizePattern(pointsAt(july), { now: july });
    expect(summary.headline).toBe("14 of 15 after more than 10 h parked, all below 60 °F");
    expect(summary.temperature.coldest).toBeGreaterThanOrEqual(30);
  });
});
