// Adds the demo scenario once (each seeder is recorded in benchfold_seeds and never runs twice).
import { closeSequelize, getSequelize } from "../models";
import { createSeeder } from "../models/migrator";

async function main() {
  const done = await createSeeder(getSequelize()).up();
  console.error(`[benchfold] seeds: ${done.length ? done.map((m) => m.name).join(", ") : "already present"}`);
  await closeSequelize();
}

main().catch(async (error) => {
  console.error("[benchfold] seeding failed:", error);
  await closeSequelize();
  process.exit(1);
});
