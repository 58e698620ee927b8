import path from "node:path";
import { SequelizeStorage, Umzug } from "umzug";
import type { QueryInterface, Sequelize } from "sequelize";

type Step = { up: (p: { context: QueryInterface }) => Promise<void>; down?: (p: { context: QueryInterface }) => Promise<void> };

/**
 * Versioned, timestamped steps run in name order. Migrations change the schema;
 * seeders add the demo scenario. Each kind keeps its own ledger table, so a step runs once.
 */
function createRunner(sequelize: Sequelize, folder: "migrations" | "seeders", ledger: string) {
  return new Umzug<QueryInterface>({
    migrations: {
      // Only timestamped files are steps; helpers beside them (the demo scenario) are not.
      glob: ["[0-9]*-[0-9]*-*.ts", { cwd: path.join(__dirname, folder) }],
      resolve: ({ name, path: file, context }) => {
        const load = async (): Promise<Step> => import(file!) as Promise<Step>;
        return {
          name,
          up: async () => (await load()).up({ context }),
          down: async () => (await load()).down?.({ context }),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: ledger }),
    logger: undefined,
  });
}

export const createMigrator = (sequelize: Sequelize) => createRunner(sequelize, "migrations", "benchfold_migrations");
export const createSeeder = (sequelize: Sequelize) => createRunner(sequelize, "seeders", "benchfold_seeds");
