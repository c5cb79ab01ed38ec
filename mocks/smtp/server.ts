import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface CaughtMail {
  id: string;
  /** The SMTP user name the sender signed in with, if any: one catcher can keep many senders' mail apart. */
  mailbox: string;
  receivedAt: string;
  envelopeFrom: string;
  envelopeTo: string[];
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  attachments: { filename: string; contentType: string; size: number }[];
}

export interface FakeSmtp {
  smtpPort: number;
  httpPort: number;
  messages: CaughtMail[];
  /** Resolves with the first message matching `match`, waiting for it to arrive. */
  waitFor(match: (m: CaughtMail) => boolean, timeoutMs?: number): Promise<CaughtMail>;
  clear(): void;
  close(): Promise<void>;
}

/**
 * A local SMTP catcher: accepts every message the app sends (any user name and
 * password or none, no TLS, loopback only), keeps it in memory, and shows it
 * over a small HTTP API (GET /messages, DELETE /messages) that the owner's
 * caught-mail page reads. `?mailbox=name` narrows both to the mail sent by one
 * SMTP user name, so one catcher serves a whole test run of parallel files.
 */
export async function startFakeSmtp(options: { smtpPort?: number; httpPort?: number; keep?: number } = {}): Promise<FakeSmtp> {
  const messages: CaughtMail[] = [];
  const waiters = new Set<{ match: (m: CaughtMail) => boolean; resolve: (m: CaughtMail) => void }>();
  const keep = options.keep ?? 500;
  let counter = 0;

  const smtp = new SMTPServer({
    authOptional: true,
    // Loopback only and never a real secret: the user name just says whose mail it is.
    allowInsecureAuth: true,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? "" });
    },
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const toField = Array.isArray(parsed.to) ? parsed.to : parsed.to ? [parsed.to] : [];
          const mail: CaughtMail = {
            id: `m${Date.now().toString(36)}${(counter += 1)}`,
            mailbox: typeof session.user === "string" ? session.user : "",
            receivedAt: new Date().toISOString(),
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            from: parsed.from?.text ?? "",
            to: toField.flatMap((t) => t.value.map((v) => v.address ?? "")),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : "",
            attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? "", contentType: a.contentType, size: a.size })),
          };
          messages.unshift(mail);
          messages.splice(keep);
          for (const w of waiters) {
            if (w.match(mail)) {
              waiters.delete(w);
              w.resolve(mail);
            }
          }
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });

  const http: Server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://catcher");
    const mailbox = url.searchParams.get("mailbox");
    const inBox = (m: CaughtMail) => mailbox === null || m.mailbox === mailbox;
    if (url.pathname === "/messages" && req.method === "GET") {
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ messages: messages.filter(inBox) }));
    } else if (url.pathname === "/messages" && req.method === "DELETE") {
      const kept = messages.filter((m) => !inBox(m));
      messages.splice(0, messages.length, ...kept);
      res.writeHead(204).end();
    } else {
      res.writeHead(404).end();
    }
  });

  const smtpPort = await listen((port, cb) => smtp.listen(port, "127.0.0.1", cb), () => smtp.server.address() as AddressInfo, options.smtpPort ?? 0);
  const httpPort = await listen((port, cb) => http.listen(port, "127.0.0.1", cb), () => http.address() as AddressInfo, options.httpPort ?? 0);

  return {
    smtpPort,
    httpPort,
    messages,
    waitFor(match, timeoutMs = 10_000) {
      const found = messages.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const waiter = { match, resolve };
        waiters.add(waiter);
        setTimeout(() => {
          if (waiters.delete(waiter)) reject(new Error(`no matching mail within ${timeoutMs} ms (${messages.length} caught)`));
        }, timeoutMs).unref();
      });
    },
    clear() {
      messages.length = 0;
    },
    async close() {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      await new Promise<void>((resolve) => http.close(() => resolve()));
    },
  };
}

function listen(start: (port: number, cb: () => void) => void, address: () => AddressInfo, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    try {
      start(port, () => resolve(address().port));
    } catch (error) {
      reject(error instanceof Error ? error : new Error(String(error)));
    }
  });
}
