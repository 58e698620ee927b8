// Adds the demo scenario once (each seeder is recorded in benchfold_seeds and never runs twice).
import { db, closeDb, withDatabaseLock } from "../models";
import { createSeeder } from "../models/migrator";

async function main() {
  const { sequelize } = db();
  // Under a database lock: instances booting together seed one after the other (the second finds it done).
  const done = await withDatabaseLock(sequelize, "benchfold-seed", 300, () => createSeeder(sequelize).up());
  console.error(`[benchfold] seeds: ${done.length ? done.map((m) => m.name).join(", ") : "already present"}`);
  await closeDb();
}

main().catch(async (error) => {
  console.error("[benchfold] seeding failed:", error);
  await closeDb();
  process.exit(1);
});
