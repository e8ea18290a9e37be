import type { Knex } from "knex";

// The invented demo scenario (no real organism, lab or person). Safe to run twice: every insert is an upsert.
export async function seed(knex: Knex): Promise<void> {
  await knex("app_settings")
    .insert({ key: "demo_seed", value: JSON.stringify({ scenario: "Tidewater Lab, Glimmerfin alga", version: 1 }) })
    .onConflict("key")
    .merge();
}
