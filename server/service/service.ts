import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { addCalendarMonths, daysBetween, servicePlan } from '../calc/service-plan';
import { ConflictError, NotFoundError, ValidationError, type FieldError } from '../http/errors';
import { changedFields, updateAtVersion } from '../http/versioned-update';
import type { SiteAccess } from '../sites/access';
import {
  findVisit,
  findVisitByClientKey,
  isEngineerOf,
  listVisits,
  planFacts,
  SERVICE_TIME_ZONE,
  toServiceVisit,
  type PlanFactsRow,
  type VisitListRow,
  type VisitRow,
} from './repository';
import {
  MAX_BOOKING_YEARS_AHEAD,
  MAX_SCHEDULE_DAYS,
  VISIT_KIND_LABELS,
  type bookCalloutInputSchema,
  type scheduleQuerySchema,
  type scheduleVisitInputSchema,
  type ServicePlanView,
  type updateVisitInputSchema,
} from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

const ukDate = new Intl.DateTimeFormat('en-CA', { timeZone: SERVICE_TIME_ZONE });

/** The calendar date in the UK at that instant, as YYYY-MM-DD. */
export function ukDateOf(instant: Date): string {
  return ukDate.format(instant);
}

const repeat = (count: number, toMonitoringCentre: boolean) =>
  Array.from({ length: count }, () => ({ toMonitoringCentre }));

function bookedVisitOf(row: PlanFactsRow) {
  return row.booked_id && row.booked_due_date
    ? {
        id: row.booked_id,
        dueDate: row.booked_due_date,
        scheduledFor: row.booked_scheduled_for?.toISOString() ?? null,
        engineerName: row.booked_engineer_name,
      }
    : null;
}

export function planOf(row: PlanFactsRow, today: string): ServicePlanView {
  const inService = row.handed_over_on
    ? { on: row.handed_over_on, visitsPerYear: row.plan_at_handover }
    : row.commissioned_on
      ? { on: row.commissioned_on, visitsPerYear: null }
      : null;
  const plan = servicePlan({
    signalling: {
      monitoringCentreLinked: row.centre_linked,
      signallingPaths: [
        ...repeat(row.paths_to_centre, true),
        ...repeat(row.paths_elsewhere, false),
      ],
    },
    inService,
    lastPreventiveVisit: row.last_visit_on
      ? { on: row.last_visit_on, visitsPerYear: row.last_visit_plan }
      : null,
    today,
  });
  return {
    siteId: row.site_id,
    ...plan,
    inServiceSince: inService?.on ?? null,
    inServiceBasis: row.handed_over_on ? 'handover' : row.commissioned_on ? 'commissioning' : null,
    lastPreventiveVisitOn: row.last_visit_on,
    bookedVisit: bookedVisitOf(row),
    today,
  };
}

export async function servicePlanForSite(
  db: Knex,
  siteId: string,
  today: string,
): Promise<ServicePlanView> {
  const [row] = await planFacts(db, { siteId });
  if (!row) throw new NotFoundError();
  return planOf(row, today);
}

/** The company's sites whose next preventive visit is past due, the longest overdue first. */
export async function overdueSites(db: Knex, installerIds: string[], today: string) {
  if (installerIds.length === 0) return [];
  const rows = await db.transaction(async (trx) => {
    // The planner's estimate for a whole company is high enough to JIT-compile the query, which
    // costs several times what the query itself does (bench/service-plan.ts: ~0.75 s of JIT
    // for ~0.2 s of work at 5,000 sites).
    await trx.raw('set local jit = off');
    return planFacts(trx, { installerIds });
  });
  return rows
    .map((row) => ({ row, plan: planOf(row, today) }))
    .filter(({ plan }) => plan.overdue)
    .sort((a, b) => b.plan.daysOverdue - a.plan.daysOverdue)
    .map(({ row, plan }) => ({
      siteId: row.site_id,
      siteReference: row.reference,
      siteName: row.name,
      siteTown: row.town,
      visitsPerYear: plan.visitsPerYear,
      lastPreventiveVisitOn: plan.lastPreventiveVisitOn,
      nextDueOn: plan.nextDueOn!,
      daysOverdue: plan.daysOverdue,
      bookedVisit: plan.bookedVisit,
    }));
}

/** The visits of the caller's companies on the days asked for (by default four weeks on). */
export async function schedule(
  db: Knex,
  installerIds: string[],
  query: z.output<typeof scheduleQuerySchema>,
  today: string,
) {
  const from = query.from ?? (query.to ? addCalendarMonths(query.to, -1) : today);
  const to = query.to ?? addCalendarMonths(from, 1);
  if (daysBetween(from, to) > MAX_SCHEDULE_DAYS)
    throw new ValidationError([
      {
        path: 'query.to',
        message: `Ask for at most ${MAX_SCHEDULE_DAYS} days at a time.`,
      },
    ]);
  if (daysBetween(from, to) < 0)
    throw new ValidationError([{ path: 'query.to', message: 'The end date is before the start.' }]);
  const rows =
    installerIds.length === 0
      ? []
      : await listVisits(db, { installerIds, from, to, engineerId: query.engineerId });
  return { from, to, visits: rows.map(toServiceVisit) };
}

// --- Booking and moving visits ----------------------------------------------------------------

/**
 * Dates the office types are checked against today: a booking in the past, or years ahead
 * (nearly always a mistyped year), is refused with the field named.
 */
function dateProblems(
  input: { dueDate?: string; scheduledFor?: string | null },
  now: Date,
): FieldError[] {
  const today = ukDateOf(now);
  const latest = addCalendarMonths(today, 12 * MAX_BOOKING_YEARS_AHEAD);
  const earliestDue = addCalendarMonths(today, -12 * MAX_BOOKING_YEARS_AHEAD);
  const problems: FieldError[] = [];
  if (input.dueDate !== undefined) {
    if (input.dueDate > latest)
      problems.push({
        path: 'body.dueDate',
        message: `A due date more than ${MAX_BOOKING_YEARS_AHEAD} years ahead: check the year.`,
      });
    else if (input.dueDate < earliestDue)
      problems.push({
        path: 'body.dueDate',
        message: `A due date more than ${MAX_BOOKING_YEARS_AHEAD} years ago: check the year.`,
      });
  }
  if (input.scheduledFor) {
    const day = ukDateOf(new Date(input.scheduledFor));
    if (day < today)
      problems.push({
        path: 'body.scheduledFor',
        message: 'A visit cannot be booked for a day that has passed.',
      });
    else if (day > latest)
      problems.push({
        path: 'body.scheduledFor',
        message: `That is more than ${MAX_BOOKING_YEARS_AHEAD} years ahead: check the year.`,
      });
  }
  return problems;
}

async function requireEngineerOf(db: Knex, engineerId: string | null, installerId: string) {
  if (engineerId && !(await isEngineerOf(db, engineerId, installerId)))
    throw new ValidationError([
      { path: 'body.engineerId', message: 'Choose an engineer of your own company.' },
    ]);
}

interface PgError {
  code?: string;
  constraint?: string;
}

const ONE_BOOKED_PREVENTIVE = 'service_visits_one_booked_preventive';
const ONE_BOOKING_PER_KEY = 'service_visits_site_id_client_key_unique';

function explainBookingConflict(error: unknown): never {
  const { code, constraint } = error as PgError;
  if (code === '23505' && constraint === ONE_BOOKED_PREVENTIVE)
    throw new ConflictError(
      'A preventive visit is already booked for this site. Move that visit instead of booking another.',
    );
  throw error;
}

function describeVisit(row: Pick<VisitRow, 'kind' | 'due_date' | 'scheduled_for'>) {
  const when = row.scheduled_for
    ? `booked for ${row.scheduled_for.toISOString()}`
    : `due ${row.due_date}`;
  return `${VISIT_KIND_LABELS[row.kind]} ${when}`;
}

export async function scheduleVisit(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof scheduleVisitInputSchema>,
  actor: Actor,
  now: Date,
  /** More to write in the booking's transaction (a call-out marks its fault report booked). */
  alsoInTransaction?: (trx: Knex.Transaction, visitId: string) => Promise<void>,
): Promise<{ created: boolean; visit: ReturnType<typeof toServiceVisit> }> {
  if (input.clientKey) {
    const previous = await findVisitByClientKey(db, access.id, input.clientKey);
    if (previous) return repeatedBooking(previous, input.kind);
  }
  const problems = dateProblems(input, now);
  if (problems.length > 0) throw new ValidationError(problems);
  await requireEngineerOf(db, input.engineerId, access.installerId);

  const today = ukDateOf(now);
  const plan = input.kind === 'preventive' ? await servicePlanForSite(db, access.id, today) : null;
  const dueDate = input.dueDate ?? plan?.nextDueOn ?? today;
  let visitId: string;
  try {
    visitId = await db.transaction(async (trx) => {
      const [row] = await trx('service_visits')
        .insert({
          site_id: access.id,
          kind: input.kind,
          due_date: dueDate,
          scheduled_for: input.scheduledFor ? new Date(input.scheduledFor) : null,
          engineer_id: input.engineerId,
          plan_visits_per_year: plan?.visitsPerYear ?? null,
          reported_fault: input.reportedFault ?? null,
          client_key: input.clientKey ?? null,
          created_by: actor.actorUserId,
        })
        .returning<VisitRow[]>('*');
      await recordAuditEntry(trx, {
        ...actor,
        action: 'service_visit.scheduled',
        entityType: 'service_visit',
        entityId: row!.id,
        organisationId: access.installerId,
        summary: `Booked: ${describeVisit(row!)}`,
        changes: {
          siteId: access.id,
          engineerId: row!.engineer_id,
          planVisitsPerYear: row!.plan_visits_per_year,
        },
      });
      await alsoInTransaction?.(trx, row!.id);
      return row!.id;
    });
  } catch (error) {
    const { code, constraint } = error as PgError;
    // Two sends of one booking at once: the second finds the first's row.
    if (code === '23505' && constraint === ONE_BOOKING_PER_KEY && input.clientKey) {
      const previous = await findVisitByClientKey(db, access.id, input.clientKey);
      if (previous) return repeatedBooking(previous, input.kind);
    }
    explainBookingConflict(error);
  }
  return { created: true, visit: toServiceVisit((await findVisit(db, visitId))!) };
}

function repeatedBooking(previous: VisitListRow, kind: string) {
  if (previous.kind !== kind)
    throw new ConflictError('That record key was already used for another booking.');
  return { created: false, visit: toServiceVisit(previous) };
}

/** The office's visit, or a 404: another company's visits are not even confirmed to exist. */
export async function requireOfficeVisit(db: Knex, officeInstallerIds: string[], visitId: string) {
  const visit = await findVisit(db, visitId);
  if (!visit || !officeInstallerIds.includes(visit.installer_id)) throw new NotFoundError();
  return visit;
}

/** Assigns, moves, cancels or books again a visit, at the version the office saw. */
export async function updateVisit(
  db: Knex,
  officeInstallerIds: string[],
  visitId: string,
  input: z.output<typeof updateVisitInputSchema>,
  actor: Actor,
  now: Date,
) {
  const visit = await requireOfficeVisit(db, officeInstallerIds, visitId);
  const { version, ...patch } = input;
  const problems = dateProblems(
    {
      dueDate: patch.dueDate !== visit.due_date ? patch.dueDate : undefined,
      scheduledFor:
        patch.scheduledFor !== undefined &&
        patch.scheduledFor !== null &&
        new Date(patch.scheduledFor).getTime() !== visit.scheduled_for?.getTime()
          ? patch.scheduledFor
          : undefined,
    },
    now,
  );
  if (problems.length > 0) throw new ValidationError(problems);
  if (patch.engineerId !== undefined)
    await requireEngineerOf(db, patch.engineerId, visit.installer_id);

  try {
    await db.transaction(async (trx) => {
      const before = await trx<VisitRow>('service_visits')
        .where({ id: visitId })
        .forUpdate()
        .first();
      if (!before) throw new NotFoundError();
      // At a stale version the write below refuses anyway, with the usual reload message.
      if (before.version === version) {
        if (before.status === 'done')
          throw new ConflictError(
            'This visit is done: its record can no longer be moved or reassigned.',
          );
        if (before.status === 'cancelled' && patch.status !== 'scheduled')
          throw new ConflictError('This visit is cancelled. Book it again to change it.');
      }
      const after = await updateAtVersion<VisitRow>(
        trx,
        'service_visits',
        { id: visitId },
        version,
        {
          ...(patch.dueDate !== undefined && { due_date: patch.dueDate }),
          ...(patch.scheduledFor !== undefined && {
            scheduled_for: patch.scheduledFor ? new Date(patch.scheduledFor) : null,
          }),
          ...(patch.engineerId !== undefined && { engineer_id: patch.engineerId }),
          ...(patch.status !== undefined && { status: patch.status }),
          updated_at: trx.fn.now(),
        },
      );
      const cancelled = before.status !== 'cancelled' && after.status === 'cancelled';
      await recordAuditEntry(trx, {
        ...actor,
        action: cancelled ? 'service_visit.cancelled' : 'service_visit.updated',
        entityType: 'service_visit',
        entityId: visitId,
        organisationId: visit.installer_id,
        summary: `${cancelled ? 'Cancelled' : 'Changed'}: ${describeVisit(after)} at ${visit.site_reference}`,
        changes: changedFields(
          before as unknown as Record<string, unknown>,
          after as unknown as Record<string, unknown>,
        ),
      });
    });
  } catch (error) {
    explainBookingConflict(error);
  }
  return toServiceVisit((await findVisit(db, visitId))!);
}

// --- Call-outs ----------------------------------------------------------------------------------

interface FaultReportRow {
  id: string;
  site_id: string;
  description: string;
  status: 'open' | 'scheduled' | 'closed';
  visit_id: string | null;
}

/**
 * Books a corrective visit, from a homeowner's fault report or from a phone call. A fault report
 * is marked booked in the same transaction, so it is never left open with a visit booked for it,
 * nor booked twice.
 */
export async function bookCallout(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof bookCalloutInputSchema>,
  actor: Actor,
  now: Date,
) {
  let report: FaultReportRow | undefined;
  if (input.faultReportId) {
    report = await db<FaultReportRow>('fault_reports')
      .where({ id: input.faultReportId, site_id: access.id })
      .first();
    if (!report)
      throw new ValidationError([
        { path: 'body.faultReportId', message: 'That fault report is not on this site.' },
      ]);
  }
  const { created, visit } = await scheduleVisit(
    db,
    access,
    {
      kind: 'corrective',
      dueDate: input.dueDate,
      scheduledFor: input.scheduledFor,
      engineerId: input.engineerId,
      reportedFault: input.reportedFault ?? report?.description,
      clientKey: input.clientKey,
    },
    actor,
    now,
    report &&
      (async (trx, visitId) => {
        const current = await trx<FaultReportRow>('fault_reports')
          .where({ id: report.id })
          .forUpdate()
          .first();
        if (current?.status === 'scheduled')
          throw new ConflictError(
            'A call-out is already booked for this fault report: move that visit instead.',
          );
        if (current?.status !== 'open')
          throw new ConflictError(
            'This fault report is closed: book a call-out without it, saying what was reported.',
          );
        await trx('fault_reports')
          .where({ id: report.id })
          .update({
            status: 'scheduled',
            visit_id: visitId,
            version: trx.raw('version + 1'),
            updated_at: trx.fn.now(),
          });
        await recordAuditEntry(trx, {
          ...actor,
          action: 'fault_report.booked',
          entityType: 'fault_report',
          entityId: report.id,
          organisationId: access.installerId,
          summary: 'Call-out booked for a reported fault',
          changes: { status: { from: 'open', to: 'scheduled' }, visitId: { to: visitId } },
        });
      }),
  );
  const linked = await db('fault_reports').where({ visit_id: visit.id }).first('id');
  return {
    created,
    visit: { ...visit, faultReportId: (linked?.id as string | undefined) ?? null },
  };
}
