// Adds the demo scenario once (each seeder is recorded in benchfold_seeds and never runs twice).
import { db, closeDb } from "../models";
import { createSeeder } from "../models/migrator";

async function main() {
  const { sequelize } = db();
  const done = await createSeeder(sequelize).up();
  console.error(`[benchfold] seeds: ${done.length ? done.map((m) => m.name).join(", ") : "already present"}`);
  await closeDb();
}

main().catch(async (error) => {
  console.error("[benchfold] seeding failed:", error);
  await closeDb();
  process.exit(1);
});
