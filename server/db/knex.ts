// The one place Knex is configured; everything else receives the instance.
import knex, { type Knex } from "knex";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

export function createDb(databaseUrl: string, poolMax = 10): Knex {
  return knex({
    client: "pg",
    connection: databaseUrl,
    pool: { min: 0, max: poolMax },
    migrations: {
      directory: path.join(root, "migrations"),
      extension: "ts",
      loadExtensions: [".ts"],
      tableName: "knex_migrations",
    },
    seeds: { directory: path.join(root, "seeds"), extension: "ts", loadExtensions: [".ts"] },
  });
}

export type { Knex };
