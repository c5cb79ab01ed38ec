// The mail outbox (issue 9): mail is queued in the transaction of the change
// it reports, sent by the worker, retried while the mail server is away, sent
// exactly once when it is back, given up on after the retry schedule, sent
// again by a person; decisions on one work order within two minutes go to the
// writer as one message (issue 11, item 8).
import { and, eq, like } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { POST as decideLine } from "@/app/api/v1/lines/[id]/decision/route";
import { closeDb, getDb, writeTx } from "@/db/client";
import { retryMail } from "@/db/queries/mail-outbox";
import { mailOutbox } from "@/db/schema";
import { resetEnvCache } from "@/lib/env";
import { queueMail } from "@/lib/server/mail/queue";
import { MAX_ATTEMPTS, retryDelayMs } from "@/lib/mail/retry-schedule";
import { deliverDueMail, stopMailWorker } from "@/lib/server/mail/worker";
import { DECISION_MAIL_WINDOW_MS } from "@/lib/server/notifications/estimate";
import { startFakeSmtp, type FakeSmtp } from "@/mocks/smtp/server";
import { call, sessionUser } from "./helpers/app";
import { linesOf, workOrderByNumber } from "./helpers/work-orders";
import { freePort } from "@/tests/support/ports";


const mail = (subject: string) => ({ subject, text: `${subject}\n`, html: `<p>${subject}</p>`, link: "http://localhost:3000/floor" });
const later = (ms: number) => new Date(Date.now() + ms);
const rowsTo = (to: string) => getDb().select().from(mailOutbox).where(eq(mailOutbox.to, to));

let port: number;
let smtp: FakeSmtp | null = null;

beforeAll(async () => {
  // Every pass is run by hand here, so the clock can be moved forward.
  await stopMailWorker();
  port = await freePort();
  process.env.SMTP_URL = `smtp://127.0.0.1:${port}`;
  resetEnvCache();
});
beforeEach(async () => {
  // Nothing left over from another test is due later in this file.
  await deliverDueMail(later(24 * 60 * 60_000));
});
afterAll(async () => {
  await smtp?.close();
  delete process.env.SMTP_URL;
  resetEnvCache();
});

describe("the outbox", () => {
  it("keeps mail exactly when the change commits: a rolled-back change takes its mail with it", async () => {
    await expect(
      writeTx(async (tx) => {
        await queueMail(tx, { to: ["rollback@quarry-road.example"], template: "test", mail: mail("Never sent") });
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await rowsTo("rollback@quarry-road.example")).toHaveLength(0);
  });

  it("with the mail server stopped, keeps the message and retries; once it is back, delivers it exactly once, also after the app restarts", async () => {
    await writeTx((tx) => queueMail(tx, { to: ["Outage@Quarry-Road.example", "outage@quarry-road.example"], template: "test", mail: mail("Sent after the outage") }));
    const [queued] = await rowsTo("outage@quarry-road.example");
    expect(queued).toMatchObject({ status: "queued", attempts: 0 });

    // Nothing listens on the port: the attempt fails and is scheduled again.
    const t0 = new Date();
    expect(await deliverDueMail(t0)).toMatchObject({ sent: 0, retry: 1 });
    const [failed] = await rowsTo("outage@quarry-road.example");
    expect(failed).toMatchObject({ status: "queued", attempts: 1 });
    expect(failed!.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(Date.parse(failed!.sendAfter) - t0.getTime()).toBe(retryDelayMs(1));
    // Not due yet: a pass now sends nothing and tries nothing.
    expect(await deliverDueMail(t0)).toEqual({ sent: 0, retry: 0, failed: 0 });

    // The app restarts (the database handle is closed and opened again); the mail server comes back.
    closeDb();
    smtp = await startFakeSmtp({ smtpPort: port, httpPort: 0 });
    expect(await deliverDueMail(later(retryDelayMs(1)! + 1000))).toMatchObject({ sent: 1 });
    expect(await deliverDueMail(later(60 * 60_000))).toEqual({ sent: 0, retry: 0, failed: 0 });
    const caught = smtp.messages.filter((m) => m.subject === "Sent after the outage");
    expect(caught).toHaveLength(1);
    expect(caught[0]!.to).toEqual(["outage@quarry-road.example"]);
    const [sent] = await rowsTo("outage@quarry-road.example");
    expect(sent).toMatchObject({ status: "sent", attempts: 2, lastError: null });
  });

  it("gives up after the retry schedule, shows the failure, and sends it when a person asks", async () => {
    await smtp?.close();
    smtp = null;
    await writeTx((tx) => queueMail(tx, { to: ["gives-up@quarry-road.example"], template: "test", mail: mail("Eventually sent by hand") }));
    let clock = Date.now();
    for (let attempt = 1; attempt <= MAX_ATTEMPTS; attempt += 1) {
      await deliverDueMail(new Date(clock));
      clock += (retryDelayMs(attempt) ?? 0) + 1000;
    }
    const [row] = await rowsTo("gives-up@quarry-road.example");
    expect(row).toMatchObject({ status: "failed", attempts: MAX_ATTEMPTS });

    smtp = await startFakeSmtp({ smtpPort: port, httpPort: 0 });
    await retryMail(await sessionUser("owner@quarry-road.example"), row!.id);
    expect(await deliverDueMail()).toMatchObject({ sent: 1 });
    expect(smtp.messages.filter((m) => m.subject === "Eventually sent by hand")).toHaveLength(1);
  });
});

describe("decisions on one work order within two minutes", () => {
  it("reach the service writer as one message listing all of them", async () => {
    if (!smtp) smtp = await startFakeSmtp({ smtpPort: port, httpPort: 0 });
    const wo = await workOrderByNumber(1042);
    const lines = (await linesOf(wo.id)).filter((l) => l.state === "proposed").slice(0, 3);
    expect(lines).toHaveLength(3);
    // Three decisions in a minute, as the supervisor works down the list on a phone.
    for (const [i, line] of lines.entries()) {
      const res = await call(decideLine, {
        path: `/api/v1/lines/${line.id}/decision`,
        params: { id: line.id },
        as: "supervisor@brennan-twp.example",
        body: { decision: i === 1 ? "decline" : "hold", expectedVersion: line.version },
      });
      expect(res.status).toBe(200);
    }
    const writer = "writer@quarry-road.example";
    const queued = await getDb().select().from(mailOutbox).where(and(eq(mailOutbox.to, writer), like(mailOutbox.groupKey, `decision_made:${wo.id}|%`)));
    expect(queued).toHaveLength(1);

    // Inside the window nothing goes; after it, one message with every decision.
    expect((await deliverDueMail(later(60_000))).sent).toBe(0);
    await deliverDueMail(later(DECISION_MAIL_WINDOW_MS + 1000));
    const caught = smtp.messages.filter((m) => m.to.includes(writer) && m.subject.startsWith("W-1042"));
    expect(caught).toHaveLength(1);
    expect(caught[0]!.subject).toBe("W-1042 · T-14: 3 decisions by Gary Holm");
    expect(caught[0]!.text.match(/^Gary Holm (hold for later|decline) 1 line/gm)).toHaveLength(3);

    // A decision after the message went out starts a new one.
    const next = (await linesOf(wo.id)).find((l) => l.state === "proposed")!;
    await call(decideLine, { path: "/x", params: { id: next.id }, as: "supervisor@brennan-twp.example", body: { decision: "hold", expectedVersion: next.version } });
    expect(await getDb().select().from(mailOutbox).where(and(eq(mailOutbox.to, writer), eq(mailOutbox.status, "queued")))).toHaveLength(1);
  });
});
