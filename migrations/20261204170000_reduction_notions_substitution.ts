// Node elimination and percolation of constants are stored as reductions of their own notions, so the notion check
// grows by those two.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`alter table reductions drop constraint reductions_notion_check`);
  await knex.raw(`alter table reductions add constraint reductions_notion_check check (notion in
    ('block-emulation','dynamical-embedding','coarse-graining','node-elimination','constant-percolation'))`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
