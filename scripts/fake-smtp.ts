/**
 * The local fake SMTP server for development and tests: accepts every message on
 * 127.0.0.1:$SMTP_PORT, keeps the newest 500 in memory and shows them as JSON on
 * 127.0.0.1:$BENCHFOLD_MAILBOX_PORT (GET /messages, DELETE /messages, GET /health). For fault tests,
 * DELETE /smtp closes the SMTP port (new connections are refused, open ones answer 421) and
 * PUT /smtp opens it again, while the read-out keeps what was caught (methods a web page cannot
 * send to another origin without a preflight, which the read-out does not answer).
 * Never started in production: the scripts start it only when no SMTP_HOST is configured.
 * Both listen on 127.0.0.1 only; the read-out also refuses a request relayed by a proxy or
 * naming another host (a web page reaching it through DNS rebinding), since the caught mail
 * holds password-reset and invitation links.
 */
import { createServer, type IncomingMessage } from "node:http";
import { randomUUID } from "node:crypto";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

type Caught = { id: string; messageId: string | null; listUnsubscribe: string | null; from: string; to: string; subject: string; text: string; html: string | null; date: string };

const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const httpPort = Number(process.env.BENCHFOLD_MAILBOX_PORT ?? 2580);
const messages: Caught[] = [];
const maxMessages = 500;
const maxMessageBytes = 5 * 1024 * 1024;

const makeSmtp = () => new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  size: maxMessageBytes,
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        messages.unshift({
          id: randomUUID(),
          messageId: mail.messageId ?? null,
          // The header as sent (mailparser parses it into parts; tests want the line itself).
          listUnsubscribe: mail.headerLines.find((h) => h.key === "list-unsubscribe")?.line.replace(/^[^:]*:\s*/, "") ?? null,
          from: mail.from?.text ?? session.envelope.mailFrom?.toString() ?? "",
          to: session.envelope.rcptTo.map((r) => r.address).join(", "),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : null,
          date: (mail.date ?? new Date()).toISOString(),
        });
        messages.length = Math.min(messages.length, maxMessages);
        callback();
      })
      .catch((error: Error) => callback(error));
  },
});

const loopbackHosts = new Set(["127.0.0.1", "localhost", "[::1]"]);
const forwardingHeaders = ["forwarded", "x-forwarded-for", "x-forwarded-host", "x-real-ip", "via"];

function fromThisMachine(req: IncomingMessage): boolean {
  const peer = (req.socket.remoteAddress ?? "").replace(/^::ffff:/, "");
  const hostname = (req.headers.host ?? "").replace(/:\d+$/, "").toLowerCase();
  return (peer === "::1" || peer.startsWith("127.")) && loopbackHosts.has(hostname) && !forwardingHeaders.some((h) => req.headers[h] !== undefined);
}

let smtp = makeSmtp();
let smtpListening = false;
const listenSmtp = (then: () => void) => {
  smtp.listen(smtpPort, "127.0.0.1", () => {
    smtpListening = true;
    then();
  });
};

const http = createServer((req, res) => {
  const send = (status: number, body: unknown) => {
    res.writeHead(status, { "content-type": "application/json", "cache-control": "no-store" });
    res.end(JSON.stringify(body));
  };
  if (!fromThisMachine(req)) return send(404, { error: "not found" });
  if (req.url === "/health") return send(200, { ok: true, smtpPort, smtpListening });
  if (req.url === "/messages" && req.method === "GET") return send(200, { messages });
  if (req.url === "/messages" && req.method === "DELETE") {
    messages.length = 0;
    return send(200, { ok: true });
  }
  if (req.url === "/smtp" && req.method === "DELETE") {
    if (smtpListening) smtp.close(() => undefined);
    smtpListening = false;
    return send(200, { ok: true, smtpListening });
  }
  if (req.url === "/smtp" && req.method === "PUT") {
    if (smtpListening) return send(200, { ok: true, smtpListening });
    smtp = makeSmtp();
    return listenSmtp(() => send(200, { ok: true, smtpListening }));
  }
  send(404, { error: "not found" });
});

listenSmtp(() => {
  http.listen(httpPort, "127.0.0.1", () => console.log(`fake SMTP on 127.0.0.1:${smtpPort}, read-out on 127.0.0.1:${httpPort}`));
});

const stop = () => {
  smtp.close(() => undefined);
  http.close(() => process.exit(0));
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
