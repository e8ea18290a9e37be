import type { Knex } from "knex";

// Who did what, when, per project. The actor's name is copied so the log still reads after an account is deleted.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("audit_log", (t) => {
    t.bigIncrements("id", { primaryKey: false });
    t.primary(["id"], { constraintName: "audit_log_pkey" });
    t.uuid("project_id")
      .notNullable()
      .references("id")
      .inTable("projects")
      .onDelete("CASCADE")
      .withKeyName("audit_log_project_id_fkey");
    t.uuid("actor_id").references("id").inTable("users").onDelete("SET NULL").withKeyName("audit_log_actor_id_fkey");
    t.text("actor_name").notNullable().defaultTo("");
    t.text("action").notNullable();
    t.text("target");
    t.jsonb("details").notNullable().defaultTo("{}");
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["project_id", "created_at"], "audit_log_project_created_index");
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
