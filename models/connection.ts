import { Sequelize } from "sequelize";

export type DatabaseSettings = {
  host: string;
  port: number;
  database: string;
  user: string;
  password: string;
};

/** Connection settings from the environment, with the defaults the project's scripts use. */
export function readDatabaseSettings(env: NodeJS.ProcessEnv = process.env): DatabaseSettings {
  return {
    host: env.DB_HOST ?? "127.0.0.1",
    port: Number(env.DB_PORT ?? 3407),
    database: env.DB_NAME ?? "benchfold",
    user: env.DB_USER ?? "benchfold",
    password: env.DB_PASSWORD ?? "benchfold-local-only",
  };
}

export function createSequelize(settings: DatabaseSettings = readDatabaseSettings()): Sequelize {
  return new Sequelize(settings.database, settings.user, settings.password, {
    host: settings.host,
    port: settings.port,
    dialect: "mariadb",
    logging: false,
    timezone: "+00:00",
    dialectOptions: {
      timezone: "+00:00",
      // COUNT(*) and BIGINT come back as numbers, so JSON.stringify never meets a BigInt.
      bigIntAsNumber: true,
      insertIdAsNumber: true,
      decimalAsNumber: true,
      connectTimeout: 10_000,
    },
    pool: { max: 10, min: 0, idle: 10_000, acquire: 20_000 },
    define: { underscored: true, timestamps: true },
  });
}
