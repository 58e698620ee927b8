import { execFile } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";

/**
 * Stopping and starting the run's own MariaDB (the one scripts/db.sh started for this worktree),
 * for the fault tests. A test that kills it runs alone in its file (integration files run one at a
 * time) and starts it again before it ends.
 */
const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../../..");
const DATA_DIR = process.env.BENCHFOLD_DATA_DIR ?? path.join(ROOT, ".data");

/** SIGKILL, no shutdown: what a crash or a lost machine looks like to the app. */
export const killDatabase = () => process.kill(Number(readFileSync(path.join(DATA_DIR, "run/mariadb.pid"), "utf8").trim()), "SIGKILL");

export const startDatabase = () => run("bash", [path.join(ROOT, "scripts/db.sh"), "start"], { cwd: ROOT, env: process.env });
