import type { Knex } from "knex";

// One role per person per project; site admins need no row to act in a project.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("memberships", (t) => {
    t.uuid("project_id")
      .notNullable()
      .references("id")
      .inTable("projects")
      .onDelete("CASCADE")
      .withKeyName("memberships_project_id_fkey");
    t.uuid("user_id")
      .notNullable()
      .references("id")
      .inTable("users")
      .onDelete("CASCADE")
      .withKeyName("memberships_user_id_fkey");
    t.text("role").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(["project_id", "user_id"], { constraintName: "memberships_pkey" });
    t.index(["user_id"], "memberships_user_id_index");
  });
  await knex.raw(
    `alter table memberships add constraint memberships_role_check check (role in ('owner', 'modeler', 'reviewer', 'viewer'))`,
  );
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
