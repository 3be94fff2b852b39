import type { Knex } from "knex";

/**
 * Login attempts learn which device they came from and what they were for. `device` holds the id
 * from a valid device cookie (lib/auth/device-cookie.ts): such attempts are counted per device and
 * not against the account, so a stranger's failures cannot lock the member's own device out.
 * `purpose` separates sign-ins from password re-entry (approving, changing the password).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("login_attempts", (t) => {
    t.string("device", 32).nullable();
    t.string("purpose", 20).notNullable().defaultTo("sign_in");
    t.index(["device", "created_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("login_attempts", (t) => {
    t.dropIndex(["device", "created_at"]);
    t.dropColumn("purpose");
    t.dropColumn("device");
  });
}
