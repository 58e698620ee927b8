// Prints next-auth's signing secret, shared by every instance on this database (models/instance-secrets.ts).
// `npm start` runs it after the migrations when NEXTAUTH_SECRET is not configured. A secret an
// earlier version kept in .data/nextauth-secret becomes the database's, so its sessions stay valid.
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { db, closeDb, sharedSecret } from "../models";

async function main() {
  const legacy = path.join(process.env.BENCHFOLD_DATA_DIR ?? ".data", "nextauth-secret");
  const candidate = existsSync(legacy) ? readFileSync(legacy, "utf8").trim() : undefined;
  process.stdout.write(await sharedSecret(db().sequelize, "nextauth", candidate));
  await closeDb();
}

main().catch(async (error) => {
  console.error("[benchfold] could not read the shared secret:", error);
  await closeDb();
  process.exit(1);
});
