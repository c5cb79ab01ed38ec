import { describe, expect, it } from "vitest";
import { unitReadyMail } from "@/lib/mail/templates/unit-ready";

describe("the Ready for pickup e-mail", () => {
  const facts = {
    shopName: "Quarry Road Truck & Equipment",
    unitNumber: "T-14",
    unitDescription: "Tandem-axle dump with front plow and side wing",
    workOrderLabel: "W-1042",
    note: "Keys at the front counter.",
    url: "https://cotter.example/fleet/units/abc",
  };

  it("names the unit and the visit, quotes the shop's note and links straight to the unit's page", () => {
    const mail = unitReadyMail(facts);
    expect(mail.subject).toBe("T-14 is ready for pickup (W-1042)");
    expect(mail.link).toBe("https://cotter.example/fleet/units/abc");
    expect(mail.text).toContain("“Keys at the front counter.”");
    expect(mail.html).toContain('href="https://cotter.example/fleet/units/abc"');
    expect(mail.html).toContain("Quarry Road Truck &amp; Equipment");
  });

  it("leaves the note out when there is none", () => {
    expect(unitReadyMail({ ...facts, note: "" }).text).not.toContain("The shop's note");
  });
});
