import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { ForbiddenError, NotFoundError, ValidationError } from '../http/errors';
import { changedFields, updateAtVersion } from '../http/versioned-update';
import { isInstallerStaff, type SiteAccess } from '../sites/access';
import { findUserSlot, slotColumns, type UserSlotRow } from './repository';
import type { createUserSlotSchema, updateUserSlotSchema } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'> & {
  actorUserId?: string | null;
};

/** Access level 3 is the engineer's: only the installer's staff record who holds it. */
function checkLevel(access: SiteAccess, level: number | undefined) {
  if (level === 3 && !isInstallerStaff(access)) {
    throw new ValidationError([
      {
        path: 'body.accessLevel',
        message: 'Only your installer can record an engineer (level 3) slot.',
      },
    ]);
  }
}

export async function addUserSlot(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof createUserSlotSchema>,
  actor: Actor,
) {
  checkLevel(access, input.accessLevel);
  const id = await db
    .transaction(async (trx) => {
      const [row] = await trx('user_code_slots')
        .insert({
          ...slotColumns(input),
          slot: input.slot,
          site_id: access.id,
          changed_by: actor.actorUserId,
        })
        .returning<UserSlotRow[]>('*');
      await recordAuditEntry(trx, {
        ...actor,
        action: 'user_slot.added',
        entityType: 'user_slot',
        entityId: row!.id,
        organisationId: access.installerId,
        summary: `Recorded user-code slot ${input.slot} for ${input.holderName} (level ${input.accessLevel})`,
      });
      return row!.id;
    })
    .catch((error: { code?: string }) => {
      if (error.code === '23505') {
        throw new ValidationError([
          { path: 'body.slot', message: `Slot ${input.slot} is already recorded.` },
        ]);
      }
      throw error;
    });
  return (await findUserSlot(db, access.id, id))!;
}

export async function updateUserSlot(
  db: Knex,
  access: SiteAccess,
  slotId: string,
  input: z.output<typeof updateUserSlotSchema>,
  actor: Actor,
) {
  const { version, ...patch } = input;
  if (patch.accessLevel !== undefined && !isInstallerStaff(access)) {
    throw new ValidationError([
      { path: 'body.accessLevel', message: 'Ask your installer to change a slot’s access level.' },
    ]);
  }
  await db.transaction(async (trx) => {
    const before = await trx<UserSlotRow>('user_code_slots')
      .where({ site_id: access.id, id: slotId })
      .first();
    if (!before) throw new NotFoundError();
    if (before.access_level === 3 && !isInstallerStaff(access)) {
      throw new ForbiddenError('The engineer’s slot is kept by your installer.');
    }
    const merged = {
      from: patch.validFrom ?? before.valid_from,
      to: patch.validTo ?? before.valid_to,
    };
    if (merged.from && merged.to && merged.to < merged.from) {
      throw new ValidationError([
        { path: 'body.validTo', message: 'The end date is before the start.' },
      ]);
    }
    const after = await updateAtVersion<UserSlotRow>(
      trx,
      'user_code_slots',
      { id: slotId },
      version,
      {
        ...slotColumns(patch),
        changed_by: actor.actorUserId,
        changed_at: trx.fn.now(),
      },
    );
    await recordAuditEntry(trx, {
      ...actor,
      action: 'user_slot.updated',
      entityType: 'user_slot',
      entityId: slotId,
      organisationId: access.installerId,
      summary: `Updated user-code slot ${after.slot} (${after.holder_name})`,
      changes: changedFields(
        before as unknown as Record<string, unknown>,
        after as unknown as Record<string, unknown>,
        ['version', 'changed_at', 'changed_by'],
      ),
    });
  });
  return (await findUserSlot(db, access.id, slotId))!;
}

export async function removeUserSlot(db: Knex, access: SiteAccess, slotId: string, actor: Actor) {
  await db.transaction(async (trx) => {
    const [removed] = await trx('user_code_slots')
      .where({ site_id: access.id, id: slotId })
      .delete()
      .returning<UserSlotRow[]>('*');
    if (!removed) throw new NotFoundError();
    await recordAuditEntry(trx, {
      ...actor,
      action: 'user_slot.removed',
      entityType: 'user_slot',
      entityId: slotId,
      organisationId: access.installerId,
      summary: `Removed user-code slot ${removed.slot} (${removed.holder_name})`,
    });
  });
}
