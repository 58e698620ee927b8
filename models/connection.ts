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

export type ReplicaHost = { host: string; port: number };

/**
 * The read replicas for public reads (lib/server/db/public-reads.ts), from DB_REPLICA_HOSTS:
 * `host:port` (or `host`, port 3306) separated by commas; none when it is unset or empty. They
 * take DB_NAME and DB_REPLICA_USER / DB_REPLICA_PASSWORD (default: DB_USER / DB_PASSWORD).
 */
export function readReplicaHosts(env: Record<string, string | undefined> = process.env): ReplicaHost[] {
  return (env.DB_REPLICA_HOSTS ?? "")
    .split(",")
    .map((entry) => entry.trim())
    .filter(Boolean)
    .map((entry) => {
      const match = /^(\[[^\]]+\]|[^:]+)(?::(\d{1,5}))?$/.exec(entry);
      const port = match?.[2] === undefined ? 3306 : Number(match[2]);
      if (!match || port < 1 || port > 65535) throw new Error(`DB_REPLICA_HOSTS: "${entry}" is not host or host:port (port 1–65535)`);
      return { host: match[1].replace(/^\[|\]$/g, ""), port };
    });
}

/**
 * A Sequelize for the app's models, on the primary; or, with `replicas`, one that reads from them
 * (Sequelize's `replication`: every SELECT outside a transaction goes to a read pool, taking the
 * replicas in turn; the rest to the primary). Only lib/server/db/public-reads.ts makes the second.
 */
export function createSequelize(settings: DatabaseSettings = readDatabaseSettings(), replicas: ReplicaHost[] = [], env: Record<string, string | undefined> = process.env): Sequelize {
  const primary = { host: settings.host, port: settings.port, username: settings.user, password: settings.password };
  const reader = (r: ReplicaHost) => ({ host: r.host, port: r.port, username: env.DB_REPLICA_USER ?? settings.user, password: env.DB_REPLICA_PASSWORD ?? settings.password });
  return new Sequelize(settings.database, settings.user, settings.password, {
    host: settings.host,
    port: settings.port,
    ...(replicas.length ? { replication: { read: replicas.map(reader), write: primary } } : {}),
    dialect: "mariadb",
    logging: false,
    timezone: "+00:00",
    dialectOptions: {
      timezone: "+00:00",
      // COUNT(*) and BIGINT come back as numbers, so JSON.stringify never meets a BigInt.
      bigIntAsNumber: true,
      insertIdAsNumber: true,
      decimalAsNumber: true,
      // A replica that does not answer is passed over quickly (public reads fall back to the primary).
      connectTimeout: replicas.length ? 2_000 : 10_000,
    },
    pool: { max: 10, min: 0, idle: 10_000, acquire: 20_000 },
    define: { underscored: true, timestamps: true },
  });
}
