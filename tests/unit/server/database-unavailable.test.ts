import { ConnectionAcquireTimeoutError, ConnectionRefusedError, DatabaseError, UniqueConstraintError, ValidationError } from "sequelize";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
const { isDatabaseUnavailable } = await import("@/lib/server/db/database-unavailable");

/** A driver error as the mariadb connector raises it (SqlError: code, errno, fatal), wrapped by Sequelize. */
function driverError(code: string, errno: number): Error {
  return Object.assign(new Error(`(conn=12, no: ${errno}, SQLState: 08S01) ${code}`), { code, errno, fatal: true });
}

describe("isDatabaseUnavailable", () => {
  it.each([
    ["connection refused (Sequelize ConnectionRefusedError)", new ConnectionRefusedError(driverError("ECONNREFUSED", 45028))],
    ["pool acquire timeout", new ConnectionAcquireTimeoutError(new Error("timeout"))],
    // CR_SERVER_LOST 2013 and CR_SERVER_GONE_ERROR 2006: MySQL/MariaDB client error reference.
    ["server lost mid-query, wrapped in a DatabaseError", new DatabaseError(Object.assign(driverError("ER_SOCKET_UNEXPECTED_CLOSE", 45007), { sql: "INSERT" }))],
    ["server gone away", Object.assign(new Error("gone"), { errno: 2006 })],
    // ER_CONNECTION_KILLED 1927 and ER_SERVER_SHUTDOWN 1053: MariaDB server error reference.
    ["connection killed by a shutdown", { parent: { errno: 1927 } }],
    ["server shutting down", { original: { errno: 1053 } }],
  ])("%s → unavailable", (_name, error) => {
    expect(isDatabaseUnavailable(error)).toBe(true);
  });

  it.each([
    ["a duplicate key", new UniqueConstraintError({ message: "Duplicate entry" })],
    ["a failed validation", new ValidationError("bad", [])],
    ["a syntax error from the server", new DatabaseError(Object.assign(new Error("syntax"), { code: "ER_PARSE_ERROR", errno: 1064, sql: "x" }))],
    ["a plain bug", new TypeError("undefined is not a function")],
    ["nothing", undefined],
  ])("%s → not unavailable", (_name, error) => {
    expect(isDatabaseUnavailable(error)).toBe(false);
  });

  it("does not loop on an error that wraps itself", () => {
    const error: { cause?: unknown } = {};
    error.cause = error;
    expect(isDatabaseUnavailable(error)).toBe(false);
  });
});
