import type { Knex } from 'knex';
import { DEMO_ACCOUNTS } from '../ops/idp/demo-accounts.js';

/**
 * Demo staff with their roles. Idempotent: an existing user (and any role an admin changed
 * since) is left as it is, so a second start changes nothing.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    for (const account of DEMO_ACCOUNTS) {
      const inserted = await trx('users')
        .insert({ email: account.email, name: account.name })
        .onConflict('email')
        .ignore()
        .returning<{ id: string }[]>('id');
      if (inserted.length === 0) continue;
      await trx('user_roles').insert(account.roles.map((role) => ({ user_id: inserted[0].id, role })));
    }
  });
}
