import type { Knex } from "knex";

// Messages caught by the local SMTP fake (development and tests), shown to site admins on the mailbox page.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("mail_messages", (t) => {
    t.uuid("id").primary({ constraintName: "mail_messages_pkey" }).defaultTo(knex.raw("gen_random_uuid()"));
    t.text("mail_from").notNullable();
    t.specificType("mail_to", "text[]").notNullable();
    t.text("subject").notNullable().defaultTo("");
    t.text("text_body").notNullable().defaultTo("");
    t.text("raw").notNullable();
    t.timestamp("received_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(["received_at"], "mail_messages_received_at_index");
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
