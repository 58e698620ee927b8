import { readDatabaseSettings } from "@/models/connection";

const loopback = new Set(["127.0.0.1", "localhost", "::1"]);

/** Tests write and delete freely: they refuse to run against any database not on this machine. */
export function assertLoopbackDatabase(): void {
  const { host, database } = readDatabaseSettings();
  if (!loopback.has(host)) throw new Error(`refusing to run tests against database host ${host}: loopback only`);
  if (!database.includes("test")) throw new Error(`refusing to run tests against database '${database}': its name must contain 'test'`);
}

export const baseUrl = process.env.BENCHFOLD_TEST_URL ?? "http://localhost:3100";
