// Operator command: migrate the database to the latest schema, optionally reset it first (tests) and seed the demo.
import { createDb } from "../../db/knex";

export const summary = "migrate the database [--reset drops everything first] [--seed loads the demo scenario]";

export async function run(args: string[]): Promise<number> {
  const url = process.env.DATABASE_URL;
  if (!url) {
    process.stderr.write("db-setup: DATABASE_URL is not set\n");
    return 2;
  }
  const unknown = args.filter((a) => a !== "--reset" && a !== "--seed");
  if (unknown.length) {
    process.stderr.write(`db-setup: unknown option ${unknown[0]}\n`);
    return 2;
  }
  const db = createDb(url, 2);
  try {
    if (args.includes("--reset")) {
      await db.raw("drop schema if exists public cascade; drop schema if exists pgboss cascade; create schema public");
    }
    const [, applied] = (await db.migrate.latest()) as [number, string[]];
    if (applied.length) process.stderr.write(`[emulant] applied ${applied.length} migration(s)\n`);
    if (args.includes("--seed")) {
      await db.seed.run();
      process.stderr.write("[emulant] demo data seeded\n");
    }
    return 0;
  } finally {
    await db.destroy();
  }
}
