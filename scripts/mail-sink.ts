/**
 * Local e-mail sink for development and tests: accepts every message on SMTP (loopback only)
 * and shows what arrived over HTTP. Nothing is relayed anywhere.
 *   GET /                 a readable list
 *   GET /api/messages     JSON list (newest first)
 *   DELETE /api/messages  empties the sink
 */
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import { join } from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}

const smtpPort = Number(arg("smtp-port", "2525"));
const httpPort = Number(arg("http-port", "8025"));
const dir = arg("dir", ".run/mail");
mkdirSync(dir, { recursive: true });

interface Stored {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** The Message-ID header as sent (the outbox row names itself there: exactly-once checks count these). */
  messageId: string | null;
}

function list(): Stored[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .map((f) => JSON.parse(readFileSync(join(dir, f), "utf8")) as Stored)
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const id = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;
        const stored: Stored = {
          id,
          receivedAt: new Date().toISOString(),
          from: mail.from?.text ?? String(session.envelope.mailFrom && session.envelope.mailFrom.address),
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : null,
          messageId: mail.messageId ?? null,
        };
        writeFileSync(join(dir, `${id}.json`), JSON.stringify(stored, null, 2));
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});
smtp.listen(smtpPort, "127.0.0.1");

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

createServer((req, res) => {
  if (req.url === "/api/messages" && req.method === "DELETE") {
    for (const f of readdirSync(dir)) rmSync(join(dir, f));
    res.writeHead(204).end();
    return;
  }
  if (req.url === "/api/messages") {
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(list()));
    return;
  }
  const rows = list()
    .map(
      (m) =>
        `<article><h2>${escape(m.subject)}</h2><p><b>To</b> ${escape(m.to.join(", "))} · <b>From</b> ${escape(m.from)} · ${escape(m.receivedAt)}</p><pre>${escape(m.text)}</pre></article>`,
    )
    .join("\n");
  res
    .writeHead(200, { "content-type": "text/html; charset=utf-8" })
    .end(
      `<!doctype html><meta charset="utf-8"><title>Synledger mail sink</title><style>body{font:14px system-ui;margin:2rem;color:#1b2a41}article{border-top:1px solid #ccc;padding:.5rem 0}pre{white-space:pre-wrap}</style><h1>Local mail sink</h1><p>Messages sent by the app on this machine. Nothing leaves it.</p>${rows || "<p>No messages yet.</p>"}`,
    );
}).listen(httpPort, "127.0.0.1");

console.log(`mail sink: smtp 127.0.0.1:${smtpPort}, http 127.0.0.1:${httpPort}, dir ${dir}`);
