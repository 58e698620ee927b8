import "server-only";
import { ConnectionError } from "sequelize";
import { AppError } from "@/lib/errors";

// MariaDB client and server codes that mean the connection is gone, not that the query was wrong:
// CR_SERVER_GONE_ERROR 2006, CR_SERVER_LOST 2013, ER_SERVER_SHUTDOWN 1053, ER_CONNECTION_KILLED 1927
// (MariaDB error reference), and the Node driver's socket and pool codes.
const LOST_ERRNOS = new Set([2006, 2013, 1053, 1927]);
const LOST_CODES = /^(ECONNREFUSED|ECONNRESET|EPIPE|ETIMEDOUT|EHOSTUNREACH|ER_SOCKET_UNEXPECTED_CLOSE|ER_CONNECTION_TIMEOUT|ER_GET_CONNECTION_TIMEOUT|ER_CLOSING_POOL|ER_CONNECTION_ALREADY_CLOSED|ER_SERVER_SHUTDOWN|ER_CONNECTION_KILLED|ER_CMD_CONNECTION_CLOSED)$/;

/** True when an error (or what it wraps) says the database could not be reached, rather than that a query failed. */
export function isDatabaseUnavailable(error: unknown): boolean {
  const seen = new Set<unknown>();
  for (let e: unknown = error; e && typeof e === "object" && !seen.has(e); ) {
    seen.add(e);
    if (e instanceof ConnectionError) return true;
    const { code, errno } = e as { code?: unknown; errno?: unknown };
    if (typeof code === "string" && LOST_CODES.test(code)) return true;
    if (typeof errno === "number" && LOST_ERRNOS.has(errno)) return true;
    const next = e as { parent?: unknown; original?: unknown; cause?: unknown };
    e = next.parent ?? next.original ?? next.cause;
  }
  return false;
}

export const databaseUnavailable = () =>
  new AppError("unavailable", "Benchfold cannot reach its database just now. Nothing was saved; try again in a minute.");
