import type { Knex } from "knex";

// The original uploaded file, byte for byte, beside the revision it produced (provenance: what exactly was imported).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("model_files", (t) => {
    t.uuid("id").primary({ constraintName: "model_files_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.uuid("revision_id")
      .notNullable()
      .references("id")
      .inTable("model_revisions")
      .onDelete("CASCADE")
      .withKeyName("model_files_revision_id_fkey");
    t.text("file_name").notNullable();
    t.text("media_type").notNullable();
    t.binary("bytes").notNullable();
    t.integer("size_bytes").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(["revision_id"], { indexName: "model_files_revision_id_key" });
  });
  await knex.raw(`alter table model_files
    add constraint model_files_file_name_check check (char_length(file_name) between 1 and 255),
    add constraint model_files_size_check check (size_bytes = octet_length(bytes) and size_bytes <= 5242880)`);
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
