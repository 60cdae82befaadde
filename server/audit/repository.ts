import type { Knex } from 'knex';

export interface AuditEntryInput {
  actorUserId?: string | null;
  actorLabel?: string | null;
  action: string;
  entityType?: string;
  entityId?: string;
  organisationId?: string | null;
  summary: string;
  /** Field-level before/after values. Callers must leave secrets out. */
  changes?: Record<string, unknown>;
  ip?: string;
  requestId?: string;
}

export interface AuditEntry {
  id: string;
  occurredAt: string;
  action: string;
  summary: string;
  actorName: string | null;
}

export async function recordAuditEntry(db: Knex, entry: AuditEntryInput): Promise<void> {
  await db('audit_log').insert({
    actor_user_id: entry.actorUserId ?? null,
    actor_label: entry.actorLabel ?? null,
    action: entry.action,
    entity_type: entry.entityType ?? null,
    entity_id: entry.entityId ?? null,
    organisation_id: entry.organisationId ?? null,
    summary: entry.summary,
    changes: entry.changes ? JSON.stringify(entry.changes) : null,
    ip: entry.ip ?? null,
    request_id: entry.requestId ?? null,
  });
}

/**
 * Entries an organisation's office may read: those filed against the organisation, and those
 * about or by its current members (sign-ins and failed sign-ins among them).
 */
export async function listAuditForOrganisation(
  db: Knex,
  organisationId: string,
  limit: number,
  before?: number,
): Promise<AuditEntry[]> {
  const members = db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.organisation_id', organisationId);
  const rows = await db('audit_log as a')
    .where((scope) =>
      scope
        .where('a.organisation_id', organisationId)
        .orWhereIn('a.actor_user_id', members.clone().select('u.id'))
        .orWhere((q) =>
          q
            .where('a.entity_type', 'account')
            .whereIn('a.entity_id', members.clone().select('u.idp_subject')),
        ),
    )
    .modify((q) => {
      if (before) q.where('a.id', '<', before);
    })
    .orderBy('a.occurred_at', 'desc')
    .orderBy('a.id', 'desc')
    .limit(limit)
    .select<
      {
        id: number;
        occurred_at: Date;
        action: string;
        summary: string;
        actor_label: string | null;
      }[]
    >('a.id', 'a.occurred_at', 'a.action', 'a.summary', 'a.actor_label');
  return rows.map((row) => ({
    id: String(row.id),
    occurredAt: row.occurred_at.toISOString(),
    action: row.action,
    summary: row.summary,
    actorName: row.actor_label,
  }));
}
