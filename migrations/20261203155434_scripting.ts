import type { Knex } from "knex";

// Personal access tokens for scripts: only the SHA-256 of the secret is stored (the secret is shown once). A token
// acts for its owner with a scope (read, or read and write), optionally limited to chosen projects; revoking keeps
// the row so the list still shows what existed and when it was last used.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("access_tokens", (t) => {
    t.uuid("id").primary({ constraintName: "access_tokens_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("user_id")
      .notNullable()
      .references("id")
      .inTable("users")
      .onDelete("CASCADE")
      .withKeyName("access_tokens_user_fkey");
    t.text("name").notNullable();
    t.text("token_hash").notNullable().unique({ indexName: "access_tokens_hash_key" });
    t.text("scope").notNullable();
    t.specificType("project_ids", "uuid[]").nullable();
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("last_used_at", { useTz: true }).nullable();
    t.timestamp("revoked_at", { useTz: true }).nullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("scope in ('read', 'write')", [], "access_tokens_scope_check");
    t.check("char_length(btrim(name)) between 1 and 120", [], "access_tokens_name_check");
    t.index(["user_id", "created_at"], "access_tokens_user_idx");
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
