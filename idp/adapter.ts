import type { Knex } from 'knex';
import type { Adapter, AdapterFactory, AdapterPayload } from 'oidc-provider';

interface PayloadRow {
  model: string;
  id: string;
  uid: string | null;
  user_code: string | null;
  grant_id: string | null;
  payload: AdapterPayload;
  consumed_at: Date | null;
}

const TABLE = 'idp.oidc_payloads';

/**
 * Keeps every oidc-provider model (sessions, interactions, grants, codes, tokens) in PostgreSQL,
 * so several IdP processes can share state and restarts keep people signed in.
 */
export function createPostgresAdapter(db: Knex): AdapterFactory {
  return (model: string): Adapter => {
    const rows = () => db<PayloadRow>(TABLE).where({ model });
    const live = (query: Knex.QueryBuilder) =>
      query.andWhere((q) => q.whereNull('expires_at').orWhere('expires_at', '>', db.fn.now()));

    async function first(query: Knex.QueryBuilder): Promise<AdapterPayload | undefined> {
      const row = (await live(query).first('payload', 'consumed_at')) as
        Pick<PayloadRow, 'payload' | 'consumed_at'> | undefined;
      if (!row) return undefined;
      return row.consumed_at
        ? { ...row.payload, consumed: Math.floor(row.consumed_at.getTime() / 1000) }
        : row.payload;
    }

    return {
      async upsert(id, payload, expiresIn) {
        await db(TABLE)
          .insert({
            model,
            id,
            payload: JSON.stringify(payload),
            grant_id: payload.grantId ?? null,
            user_code: payload.userCode ?? null,
            uid: payload.uid ?? null,
            expires_at: expiresIn ? new Date(Date.now() + expiresIn * 1000) : null,
          })
          .onConflict(['model', 'id'])
          .merge();
      },
      find: (id) => first(rows().where({ id })),
      findByUid: (uid) => first(rows().where({ uid })),
      findByUserCode: (userCode) => first(rows().where({ user_code: userCode })),
      async consume(id) {
        await rows().where({ id }).update({ consumed_at: db.fn.now() });
      },
      async destroy(id) {
        await rows().where({ id }).delete();
      },
      async revokeByGrantId(grantId) {
        await db(TABLE).where({ grant_id: grantId }).delete();
      },
    };
  };
}

/** Expired rows are invisible to find(); this removes them, run from a timer. */
export async function purgeExpiredPayloads(db: Knex): Promise<number> {
  return db(TABLE).where('expires_at', '<', db.fn.now()).delete();
}
