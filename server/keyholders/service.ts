import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors';
import { changedFields, updateAtVersion } from '../http/versioned-update';
import type { SiteAccess } from '../sites/access';
import {
  findKeyholder,
  keyholderColumns,
  listKeyholders,
  renumberCallOrder,
  toKeyholder,
  type KeyholderRow,
} from './repository';
import type { createKeyholderSchema, updateKeyholderSchema } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

// Phone numbers are personal data: the audit log notes that they changed, not what they are.
const PRIVATE_COLUMNS = ['phone', 'email', 'unavailable'];

function auditChanges(before: Record<string, unknown>, after: Record<string, unknown>) {
  const changes = changedFields(before, after, ['version', 'updated_at', 'created_at']);
  for (const column of PRIVATE_COLUMNS) {
    if (changes[column]) changes[column] = { from: '(changed)', to: '(changed)' };
  }
  return changes;
}

export async function addKeyholder(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof createKeyholderSchema>,
  actor: Actor,
) {
  return db.transaction(async (trx) => {
    // Serialise additions per site so two people adding at once get different places.
    await trx('sites').where({ id: access.id }).forUpdate().first('id');
    const { next } = (await trx('keyholders')
      .where({ site_id: access.id })
      .first(trx.raw('coalesce(max(call_order), 0) + 1 as next'))) as { next: number };
    const [row] = await trx('keyholders')
      .insert({ ...keyholderColumns(input), site_id: access.id, call_order: next })
      .returning('*');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'keyholder.added',
      entityType: 'keyholder',
      entityId: row.id,
      organisationId: access.installerId,
      summary: `Added keyholder ${row.name} as number ${next} in the call plan`,
    });
    return toKeyholder(row);
  });
}

export async function updateKeyholder(
  db: Knex,
  access: SiteAccess,
  keyholderId: string,
  input: z.output<typeof updateKeyholderSchema>,
  actor: Actor,
) {
  const { version, ...patch } = input;
  return db.transaction(async (trx) => {
    const before = await findKeyholder(trx, access.id, keyholderId);
    if (!before) throw new NotFoundError();
    const after = await updateAtVersion<KeyholderRow>(
      trx,
      'keyholders',
      { id: keyholderId },
      version,
      {
        ...keyholderColumns(patch),
        updated_at: trx.fn.now(),
      },
    );
    await recordAuditEntry(trx, {
      ...actor,
      action: 'keyholder.updated',
      entityType: 'keyholder',
      entityId: keyholderId,
      organisationId: access.installerId,
      summary: `Updated keyholder ${after.name}`,
      changes: auditChanges(
        before as unknown as Record<string, unknown>,
        after as unknown as Record<string, unknown>,
      ),
    });
    return toKeyholder(after);
  });
}

export async function removeKeyholder(
  db: Knex,
  access: SiteAccess,
  keyholderId: string,
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const [removed] = await trx('keyholders')
      .where({ site_id: access.id, id: keyholderId })
      .delete()
      .returning<KeyholderRow[]>('*');
    if (!removed) throw new NotFoundError();
    await renumberCallOrder(trx, access.id);
    await recordAuditEntry(trx, {
      ...actor,
      action: 'keyholder.removed',
      entityType: 'keyholder',
      entityId: keyholderId,
      organisationId: access.installerId,
      summary: `Removed keyholder ${removed.name} (was number ${removed.call_order})`,
    });
  });
}

export async function reorderKeyholders(
  db: Knex,
  access: SiteAccess,
  keyholderIds: string[],
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const current = await trx('keyholders')
      .where({ site_id: access.id })
      .orderBy('call_order')
      .forUpdate()
      .select<{ id: string; name: string }[]>('id', 'name');
    const known = new Set(current.map((row) => row.id));
    if (keyholderIds.length !== current.length || keyholderIds.some((id) => !known.has(id))) {
      throw new ConflictError(
        'The call plan changed since you opened it. Reload and put them in order again.',
      );
    }
    for (const [index, id] of keyholderIds.entries()) {
      await trx('keyholders')
        .where({ id })
        .update({ call_order: index + 1, updated_at: trx.fn.now() });
    }
    const names = new Map(current.map((row) => [row.id, row.name]));
    await recordAuditEntry(trx, {
      ...actor,
      action: 'keyholder.reordered',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: 'Changed the call order',
      changes: {
        callOrder: {
          from: current.map((row) => row.name),
          to: keyholderIds.map((id) => names.get(id)),
        },
      },
    });
  });
  return listKeyholders(db, access.id);
}

export async function confirmKeyholder(
  db: Knex,
  access: SiteAccess,
  keyholderId: string,
  actor: Actor,
) {
  return db.transaction(async (trx) => {
    const [row] = await trx('keyholders')
      .where({ site_id: access.id, id: keyholderId })
      .update({ last_confirmed_at: trx.fn.now() })
      .returning<KeyholderRow[]>('*');
    if (!row) throw new NotFoundError();
    await recordAuditEntry(trx, {
      ...actor,
      action: 'keyholder.confirmed',
      entityType: 'keyholder',
      entityId: keyholderId,
      organisationId: access.installerId,
      summary: `Confirmed the details of keyholder ${row.name} are current`,
    });
    return toKeyholder(row);
  });
}

export async function requireKeyholderEmail(db: Knex, access: SiteAccess, keyholderId: string) {
  const keyholder = await findKeyholder(db, access.id, keyholderId);
  if (!keyholder) throw new NotFoundError();
  if (!keyholder.email) {
    throw new ValidationError([
      { path: 'body.email', message: 'Add the keyholder’s e-mail address before inviting them.' },
    ]);
  }
  return { ...keyholder, email: keyholder.email };
}
