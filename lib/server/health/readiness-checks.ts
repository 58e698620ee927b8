import "server-only";
import net from "node:net";
import tls from "node:tls";
import { QueryTypes } from "sequelize";
import { db } from "@/models";
import { isDatabaseUnavailable } from "../db/database-unavailable";
import { StorageUnavailableError } from "../storage/object-store";
import { objectStore } from "../storage/stored-objects";

/**
 * The probes behind GET /api/health/ready, one per thing the app instance needs to serve. Each
 * resolves when its dependency answered and throws a ReadinessFailure (a sentence with no host,
 * port, user or driver message in it: the answer is public) when it did not; checkReadiness puts
 * the time limit on them.
 */
export class ReadinessFailure extends Error {
  /** What went wrong in full, for the server's log only. */
  readonly detail: string;
  constructor(message: string, cause?: unknown) {
    super(message);
    this.name = "ReadinessFailure";
    this.detail = cause === undefined ? message : String((cause as Error)?.message ?? cause).split("\n")[0];
  }
}

/** The database answers a query on this instance's own pool (so an exhausted pool counts as not ready too). */
export async function probeDatabase(): Promise<void> {
  try {
    await db().sequelize.query("SELECT 1", { type: QueryTypes.SELECT });
  } catch (error) {
    throw new ReadinessFailure(isDatabaseUnavailable(error) ? "The database cannot be reached." : "The database did not answer a query.", error);
  }
}

/**
 * The object store that holds the files (bench files, released PDFs, drawings) answers a HEAD of
 * its bucket with this instance's own client and credentials: a store that is down, a bucket that
 * is gone and credentials it refuses all count as not ready.
 */
export async function probeStorage(): Promise<void> {
  try {
    await objectStore().probe();
  } catch (error) {
    if (error instanceof StorageUnavailableError) throw new ReadinessFailure("The file store cannot be reached.", error.detail);
    throw new ReadinessFailure("The file store is not configured.", error);
  }
}

/**
 * The configured SMTP relay (SMTP_HOST, SMTP_PORT, SMTP_SECURE, the settings sendMail uses)
 * accepts a connection and greets with 220 (RFC 5321 §4.2 reply code "Service ready"); the probe
 * then says QUIT. It neither logs in nor sends, so a relay that greets and then refuses our
 * credentials still passes: what it proves is that this instance can reach the relay that its
 * direct mails (sign-up, invitations, password resets) go through.
 */
export function probeMailRelay(timeoutMs: number): Promise<void> {
  const host = process.env.SMTP_HOST ?? "127.0.0.1";
  const port = Number(process.env.SMTP_PORT ?? 2525);
  const secure = process.env.SMTP_SECURE === "1";
  return new Promise<void>((resolve, reject) => {
    const socket = secure ? tls.connect({ host, port, servername: net.isIP(host) ? undefined : host }) : net.connect({ host, port });
    let greeting = "";
    let settled = false;
    const finish = (error: Error | null) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      if (error) {
        socket.destroy();
        reject(error);
      } else {
        socket.end("QUIT\r\n");
        socket.setTimeout(1_000, () => socket.destroy());
        resolve();
      }
    };
    const timer = setTimeout(() => finish(new ReadinessFailure("The mail relay did not greet in time.")), timeoutMs);
    socket.setEncoding("latin1");
    socket.on("data", (chunk: string) => {
      greeting += chunk;
      // A greeting may span lines ("220-…" continues, "220 …" ends it); any other code is a refusal.
      const lines = greeting.split("\r\n");
      for (const line of lines.slice(0, -1)) {
        if (!line.startsWith("220")) return finish(new ReadinessFailure(`The mail relay refused the connection (reply ${line.slice(0, 3).replace(/\D/g, "") || "unreadable"}).`));
        if (line[3] !== "-") return finish(null);
      }
      if (greeting.length > 4096) finish(new ReadinessFailure("The mail relay's greeting is unreadable."));
    });
    socket.on("error", (error) => finish(new ReadinessFailure("The mail relay cannot be reached.", error)));
    socket.on("close", () => finish(new ReadinessFailure("The mail relay closed the connection without a greeting.")));
  });
}
