// Per person: which notifications also arrive by e-mail (in the app they always arrive). No row means the defaults.
import type { Knex } from "knex";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("notification_preferences", (t) => {
    t.uuid("user_id")
      .primary({ constraintName: "notification_preferences_pkey" })
      .references("id")
      .inTable("users")
      .onDelete("CASCADE")
      .withKeyName("notification_preferences_user_fkey");
    t.boolean("email_on_decision").notNullable().defaultTo(true);
    t.boolean("email_on_review_waiting").notNullable().defaultTo(false);
    t.boolean("email_on_mention").notNullable().defaultTo(true);
    t.timestamp("updated_at", { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(): Promise<void> {
  throw new Error("Migrations are forward-only: write a new migration instead");
}
