// Applies pending migrations to the database named by DB_NAME (scripts/lib.sh sets the defaults),
// holding MariaDB's named lock benchfold-migrate so two instances starting at once cannot race.
import { db, closeDb, withDatabaseLock } from "../models";
import { createMigrator } from "../models/migrator";

async function main() {
  const { sequelize } = db();
  // Under a database lock: instances booting together migrate one after the other.
  const done = await withDatabaseLock(sequelize, "benchfold-migrate", 300, () => createMigrator(sequelize).up());
  console.error(`[benchfold] migrations: ${done.length ? done.map((m) => m.name).join(", ") : "up to date"}`);
  await closeDb();
}

main().catch(async (error) => {
  console.error("[benchfold] migration failed:", error);
  await closeDb();
  process.exit(1);
});
