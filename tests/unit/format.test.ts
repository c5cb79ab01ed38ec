import { describe, expect, it } from "vitest";
import { shortTitle } from "@/lib/format";

describe("shortTitle: a complaint as a visit's title", () => {
  it("keeps a short complaint, drops the reporter and a trailing full stop", () => {
    expect(shortTitle("Wing plow will not raise.")).toBe("Wing plow will not raise");
    expect(shortTitle("Lights and reflectors: Right rear marker lamp out. (reported by Tom Brecker)")).toBe("Lights and reflectors: Right rear marker lamp out");
  });
  it("takes the first sentence and cuts a long one at a word", () => {
    const t = shortTitle("Service brakes and trailer brake connections: Air leak at the left rear brake chamber; pressure drops with the brakes applied. (reported by Tom Brecker, out of service)");
    expect(t).toBe("Service brakes and trailer brake connections: Air leak at the left…");
    expect(t.length).toBeLessThanOrEqual(71);
  });
});
