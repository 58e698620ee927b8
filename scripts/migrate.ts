// Applies pending migrations to the database named by DB_NAME (scripts/lib.sh sets the defaults).
import { db, closeDb } from "../models";
import { createMigrator } from "../models/migrator";

async function main() {
  const { sequelize } = db();
  const done = await createMigrator(sequelize).up();
  console.error(`[benchfold] migrations: ${done.length ? done.map((m) => m.name).join(", ") : "up to date"}`);
  await closeDb();
}

main().catch(async (error) => {
  console.error("[benchfold] migration failed:", error);
  await closeDb();
  process.exit(1);
});
