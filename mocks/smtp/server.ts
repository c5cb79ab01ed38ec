import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export interface CaughtMail {
  id: string;
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
 * A local SMTP catcher: accepts every message the app sends (no auth, no
 * TLS, loopback only), keeps it in memory, and shows it over a small HTTP API
 * (GET /messages, DELETE /messages) that the owner's caught-mail page reads.
 */
export async function startFakeSmtp(options: { smtpPort?: number; httpPort?: number; keep?: number } = {}): Promise<FakeSmtp> {
  const messages: CaughtMail[] = [];
  const waiters = new Set<{ match: (m: CaughtMail) => boolean; resolve: (m: CaughtMail) => void }>();
  const keep = options.keep ?? 500;
  let counter = 0;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const toField = Array.isArray(parsed.to) ? parsed.to : parsed.to ? [parsed.to] : [];
          const mail: CaughtMail = {
            id: `m${Date.now().toString(36)}${(counter += 1)}`,
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
    if (req.url === "/messages" && req.method === "GET") {
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ messages }));
    } else if (req.url === "/messages" && req.method === "DELETE") {
      messages.length = 0;
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
