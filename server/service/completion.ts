import type { Knex } from 'knex';
import { PNG } from 'pngjs';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { batteryCheck, type BudgetFacts } from '../calc/battery-check';
import { classifyReading } from '../calc/loop';
import { formatOhms } from '../calc/notation';
import { addCalendarMonths } from '../calc/service-plan';
import { BATTERY_MIN_LOADED_VOLTS, BATTERY_MIN_RESTING_VOLTS } from '../commissioning/schema';
import { walkTestFailures } from '../commissioning/service';
import { siteEngineering, type SiteEngineering } from '../engineering/site-engineering';
import { ConflictError, NotFoundError, ValidationError, type FieldError } from '../http/errors';
import { queueServiceReport } from '../service-report/repository';
import { findSystemRow } from '../systems/repository';
import { findVisit, toServiceVisit, type VisitListRow } from './repository';
import {
  CLOCK_SKEW_MINUTES,
  MAX_BOOKING_YEARS_AHEAD,
  PRIME_CAUSE_LABELS,
  VISIT_KIND_LABELS,
  type CompletedVisit,
  type completeVisitInputSchema,
  type correctiveCompletionSchema,
  type PreventiveChecklist,
  type preventiveCompletionSchema,
  type PrimeCause,
  type VisitOutcome,
  type ZoneResult,
} from './schema';
import { servicePlanForSite, ukDateOf } from './service';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;
type PreventiveInput = z.output<typeof preventiveCompletionSchema>;
type CorrectiveInput = z.output<typeof correctiveCompletionSchema>;

const plural = (count: number, one: string, many = `${one}s`) =>
  `${count} ${count === 1 ? one : many}`;

/** The engineer's visit, or a 404: another company's visits are not even confirmed to exist. */
async function requireEngineerVisit(db: Knex, engineerInstallerIds: string[], visitId: string) {
  const visit = await findVisit(db, visitId);
  if (!visit || !engineerInstallerIds.includes(visit.installer_id)) throw new NotFoundError();
  return visit;
}

function completedAtProblems(completedAt: string, now: Date): FieldError[] {
  const at = new Date(completedAt);
  if (at.getTime() > now.getTime() + CLOCK_SKEW_MINUTES * 60_000)
    return [
      {
        path: 'body.completedAt',
        message: 'A visit cannot be finished in the future: check the date and the phone’s clock.',
      },
    ];
  const earliest = addCalendarMonths(ukDateOf(now), -12 * MAX_BOOKING_YEARS_AHEAD);
  if (ukDateOf(at) < earliest)
    return [
      {
        path: 'body.completedAt',
        message: `That is more than ${MAX_BOOKING_YEARS_AHEAD} years ago: check the year.`,
      },
    ];
  return [];
}

/** The same rule as handover signatures (data URL shape and size in the schema), and a real PNG. */
function assertDrawnSignature(image: string) {
  try {
    const decoded = PNG.sync.read(Buffer.from(image.slice(image.indexOf(',') + 1), 'base64'));
    if (decoded.width > 0 && decoded.height > 0) return;
  } catch {
    // Falls through to the refusal below.
  }
  throw new ValidationError([
    {
      path: 'body.customerSignature',
      message: 'The signature must be a PNG image drawn on the signing pad.',
    },
  ]);
}

// --- The preventive checklist ------------------------------------------------------------------

const describeOhms = (ohms: number | null, open: boolean) =>
  open ? 'OL' : ohms === null ? 'no reading' : formatOhms(ohms);

function zoneResult(
  zone: SiteEngineering['zones'][number],
  reading: PreventiveInput['zones'][number],
): ZoneResult {
  const open = (ohms: number | null) => ohms !== null && !Number.isFinite(ohms);
  const finite = (ohms: number | null) => (ohms !== null && Number.isFinite(ohms) ? ohms : null);
  const base = {
    zoneId: zone.zoneId,
    number: zone.number,
    location: zone.location,
    secureReadingOhms: finite(reading.secureReading),
    secureOpen: open(reading.secureReading),
    alarmReadingOhms: finite(reading.alarmReading),
    alarmOpen: open(reading.alarmReading),
    activated: reading.activated,
    note: reading.note,
  };
  // A zone whose loop is not fully recorded cannot be classified; that is a finding for the
  // office to put right, not a reason to lose the engineer's readings.
  if (zone.bands.length === 0)
    return {
      ...base,
      secureState: null,
      alarmState: null,
      passed: false,
      failures: [
        `The loop is not fully recorded, so the reading (${describeOhms(base.secureReadingOhms, base.secureOpen)}) could not be classified: ${zone.problems.join(' ')}`,
      ],
    };
  const secure = classifyReading(zone.design, reading.secureReading);
  const alarm =
    reading.alarmReading === null ? null : classifyReading(zone.design, reading.alarmReading);
  const failures = walkTestFailures(
    secure,
    reading.secureReading,
    alarm,
    reading.alarmReading,
    reading.activated,
  );
  return {
    ...base,
    secureState: secure.state,
    alarmState: alarm?.state ?? null,
    passed: failures.length === 0,
    failures,
  };
}

function budgetFacts(engineering: SiteEngineering): BudgetFacts {
  const { power } = engineering;
  if (!power.available) return { available: false, reason: power.reason };
  return {
    available: true,
    requiredAh: power.requiredAh,
    batteryAh: power.batteryAh,
    alarmMa: power.alarmMa,
    working: power.working,
  };
}

interface PathRow {
  id: string;
  position: number;
  bearer: string;
  description: string;
}

const pathLabel = (path: PathRow) => `Signalling path ${path.position} (${path.bearer})`;
const zoneLabel = (zone: { number: number; location: string }) =>
  `Zone ${zone.number} (${zone.location})`;

/**
 * Checks the form against the system as recorded (every zone and path accounted for), then
 * classifies and judges every reading. Problems with what was sent are 400s naming the field;
 * problems the readings reveal are findings, kept with the visit.
 */
async function preventiveChecklist(
  db: Knex,
  siteId: string,
  input: PreventiveInput,
): Promise<PreventiveChecklist> {
  const [engineering, system] = await Promise.all([
    siteEngineering(db, siteId),
    findSystemRow(db, siteId),
  ]);
  if (!engineering || !system)
    throw new ConflictError('Record the system and its zones before completing a visit.');
  const paths: PathRow[] = await db('signalling_paths')
    .where({ system_id: system.id })
    .orderBy('position')
    .select('id', 'position', 'bearer', 'description');

  const zonesById = new Map(engineering.zones.map((zone) => [zone.zoneId, zone]));
  const pathsById = new Map(paths.map((path) => [path.id, path]));
  const problems: FieldError[] = [];
  input.zones.forEach((reading, index) => {
    if (!zonesById.has(reading.zoneId))
      problems.push({
        path: `body.zones.${index}.zoneId`,
        message: 'That zone is not on this site’s schedule.',
      });
  });
  input.signalling.forEach((test, index) => {
    if (!pathsById.has(test.pathId))
      problems.push({
        path: `body.signalling.${index}.pathId`,
        message: 'That signalling path is not on this system.',
      });
  });
  input.notTested.forEach((entry, index) => {
    if (entry.item === 'zone' && !zonesById.has(entry.zoneId))
      problems.push({
        path: `body.notTested.${index}.zoneId`,
        message: 'That zone is not on this site’s schedule.',
      });
    if (entry.item === 'signalling_path' && !pathsById.has(entry.pathId))
      problems.push({
        path: `body.notTested.${index}.pathId`,
        message: 'That signalling path is not on this system.',
      });
  });
  const accountedZones = new Set([
    ...input.zones.map((reading) => reading.zoneId),
    ...input.notTested.flatMap((entry) => (entry.item === 'zone' ? [entry.zoneId] : [])),
  ]);
  const untested = engineering.zones.filter((zone) => !accountedZones.has(zone.zoneId));
  if (untested.length > 0)
    problems.push({
      path: 'body.zones',
      message: `${untested.map(zoneLabel).join(', ')} ${untested.length === 1 ? 'has' : 'have'} no walk test: test ${untested.length === 1 ? 'it' : 'them'}, or list ${untested.length === 1 ? 'it' : 'them'} as not tested with the reason.`,
    });
  const accountedPaths = new Set([
    ...input.signalling.map((test) => test.pathId),
    ...input.notTested.flatMap((entry) => (entry.item === 'signalling_path' ? [entry.pathId] : [])),
  ]);
  const unsent = paths.filter((path) => !accountedPaths.has(path.id));
  if (unsent.length > 0)
    problems.push({
      path: 'body.signalling',
      message: `${unsent.map(pathLabel).join(', ')} ${unsent.length === 1 ? 'was' : 'were'} not tested: test ${unsent.length === 1 ? 'it' : 'them'}, or list ${unsent.length === 1 ? 'it' : 'them'} as not tested with the reason.`,
    });
  if (problems.length > 0) throw new ValidationError(problems);

  // A 24 V supply carries two 12 V batteries in series (common practice, no source).
  const inSeries = Number(system.supply_volts) > 20 ? 2 : 1;
  const battery = input.battery
    ? {
        ...input.battery,
        ...batteryCheck(
          input.battery,
          {
            restingVolts: BATTERY_MIN_RESTING_VOLTS * inSeries,
            loadedVolts: BATTERY_MIN_LOADED_VOLTS * inSeries,
          },
          budgetFacts(engineering),
        ),
      }
    : null;
  const zones = engineering.zones.flatMap((zone) => {
    const reading = input.zones.find((candidate) => candidate.zoneId === zone.zoneId);
    return reading ? [zoneResult(zone, reading)] : [];
  });
  const signalling = paths.flatMap((path) => {
    const test = input.signalling.find((candidate) => candidate.pathId === path.id);
    return test
      ? [
          {
            pathId: path.id,
            position: path.position,
            bearer: path.bearer,
            description: path.description,
            result: test.result,
            centreReference: test.centreReference,
          },
        ]
      : [];
  });
  const notTested = input.notTested.map((entry) => ({
    item: entry.item,
    zoneId: entry.item === 'zone' ? entry.zoneId : null,
    pathId: entry.item === 'signalling_path' ? entry.pathId : null,
    label:
      entry.item === 'zone'
        ? zoneLabel(zonesById.get(entry.zoneId)!)
        : entry.item === 'signalling_path'
          ? pathLabel(pathsById.get(entry.pathId)!)
          : NOT_TESTED_LABELS[entry.item],
    reason: entry.reason,
  }));

  const findings = [
    ...(battery?.reasons.map((reason) => `Battery: ${reason}`) ?? []),
    ...zones.flatMap((zone) => zone.failures.map((failure) => `${zoneLabel(zone)}: ${failure}`)),
    ...(input.tampers?.result === 'failed' ? ['The tamper test failed.'] : []),
    ...(input.sounders.internal?.result === 'failed' ? ['The internal sounder test failed.'] : []),
    ...(input.sounders.external?.result === 'failed' ? ['The external sounder test failed.'] : []),
    ...signalling
      .filter((path) => path.result === 'failed')
      .map(
        (path) =>
          `${pathLabel({ ...path, id: path.pathId })}: the test signal did not reach the centre.`,
      ),
  ];
  return {
    battery,
    zones,
    tampers: input.tampers,
    sounders: input.sounders,
    signalling,
    userTrainingGiven: input.userTrainingGiven,
    userConfidence: input.userConfidence,
    notTested,
    note: input.note,
    outcome: preventiveOutcome(findings, notTested.length, input.customerName ?? null),
  };
}

const NOT_TESTED_LABELS = {
  battery: 'Battery',
  tampers: 'Tampers',
  internal_sounders: 'Internal sounders',
  external_sounders: 'External sounders',
} as const;

function preventiveOutcome(
  findings: string[],
  notTestedCount: number,
  customerName: string | null,
): VisitOutcome {
  const untested =
    notTestedCount > 0
      ? ` ${plural(notTestedCount, 'item')} not tested, signed for by ${customerName}.`
      : '';
  return {
    passed: findings.length === 0,
    words:
      findings.length === 0
        ? `${notTestedCount > 0 ? 'Everything tested passed.' : 'Every check passed.'}${untested}`
        : `${plural(findings.length, 'finding')} to put right.${untested}`,
    findings,
  };
}

/** Ends the text with a full stop unless it already ends a sentence. */
const sentence = (text: string) => (/[.!?]$/.test(text) ? text : `${text}.`);

function correctiveOutcome(input: CorrectiveInput): VisitOutcome {
  const parts = input.partsReplaced.map((part) => `${part.quantity} × ${part.part}`).join(', ');
  const words = [
    sentence(`${PRIME_CAUSE_LABELS[input.primeCause]}: ${input.actionTaken}`),
    parts ? `Parts replaced: ${parts}.` : '',
    input.falseAlarm ? sentence(`False alarm, caused by: ${input.falseAlarmCause}`) : '',
  ]
    .filter(Boolean)
    .join(' ');
  return { passed: null, words, findings: [] };
}

// --- Completing ---------------------------------------------------------------------------------

/** A done visit as the engineer's phone, the office and (later) the report read it. */
export async function completedVisitOf(
  db: Knex,
  visit: VisitListRow,
  today: string,
): Promise<CompletedVisit> {
  const checklist = visit.checklist as { outcome?: VisitOutcome; note?: string };
  const outcome = checklist.outcome ?? { passed: null, words: '', findings: [] };
  const nextDueOn =
    visit.kind === 'preventive'
      ? (await servicePlanForSite(db, visit.site_id, today)).nextDueOn
      : null;
  return {
    ...toServiceVisit(visit),
    outcome,
    preventive: visit.kind === 'preventive' ? (visit.checklist as PreventiveChecklist) : null,
    corrective:
      visit.kind === 'corrective' && visit.prime_cause
        ? {
            reportedFault: visit.reported_fault,
            primeCause: visit.prime_cause as PrimeCause,
            primeCauseLabel: PRIME_CAUSE_LABELS[visit.prime_cause as PrimeCause],
            actionTaken: visit.action_taken ?? '',
            partsReplaced: visit.parts_replaced,
            falseAlarm: visit.false_alarm ?? false,
            falseAlarmCause: visit.false_alarm_cause,
            note: checklist.note ?? '',
          }
        : null,
    customerSignedBy: visit.customer_name,
    nextDueOn,
  };
}

/**
 * Records a visit as done, once: the same form sent again (same key) answers with the visit it
 * completed; a different form for a done visit is refused. Everything is written in one
 * transaction with the visit row locked, so two sends racing each other also record it once.
 */
export async function completeVisit(
  db: Knex,
  engineerInstallerIds: string[],
  visitId: string,
  input: z.output<typeof completeVisitInputSchema>,
  actor: Actor,
  now: Date,
): Promise<CompletedVisit> {
  const visit = await requireEngineerVisit(db, engineerInstallerIds, visitId);
  const today = ukDateOf(now);
  if (visit.status === 'done' && visit.completion_key === input.clientKey)
    return completedVisitOf(db, visit, today);
  refuseUnlessOpen(visit);
  if (input.kind !== visit.kind)
    throw new ValidationError([
      {
        path: 'body.kind',
        message: `This visit is a ${VISIT_KIND_LABELS[visit.kind].toLowerCase()}: fill in its own form.`,
      },
    ]);
  const problems = completedAtProblems(input.completedAt, now);
  if (problems.length > 0) throw new ValidationError(problems);

  let fields: Record<string, unknown>;
  let outcome: VisitOutcome;
  if (input.kind === 'preventive') {
    if (input.customerSignature) assertDrawnSignature(input.customerSignature);
    const checklist = await preventiveChecklist(db, visit.site_id, input);
    const plan = await servicePlanForSite(db, visit.site_id, today);
    outcome = checklist.outcome;
    fields = {
      checklist: JSON.stringify(checklist),
      customer_name: input.customerName ?? null,
      customer_signature: input.customerSignature ?? null,
      plan_visits_per_year: plan.visitsPerYear,
    };
  } else {
    if (!input.reportedFault && !visit.reported_fault)
      throw new ValidationError([
        { path: 'body.reportedFault', message: 'Say what fault you were called out to.' },
      ]);
    outcome = correctiveOutcome(input);
    fields = {
      checklist: JSON.stringify({ note: input.note, outcome }),
      reported_fault: input.reportedFault ?? visit.reported_fault,
      prime_cause: input.primeCause,
      action_taken: input.actionTaken,
      parts_replaced: JSON.stringify(input.partsReplaced),
      false_alarm: input.falseAlarm,
      false_alarm_cause: input.falseAlarm ? input.falseAlarmCause : null,
    };
  }

  await db.transaction(async (trx) => {
    const locked = await trx('service_visits')
      .where({ id: visitId })
      .forUpdate()
      .first<{ status: string; completion_key: string | null }>('status', 'completion_key');
    if (!locked) throw new NotFoundError();
    // Another send of this same form got here first: answer with what it recorded.
    if (locked.status === 'done' && locked.completion_key === input.clientKey) return;
    refuseUnlessOpen({ status: locked.status as VisitListRow['status'] });
    await trx('service_visits')
      .where({ id: visitId })
      .update({
        ...fields,
        status: 'done',
        completed_at: new Date(input.completedAt),
        completion_key: input.clientKey,
        engineer_id: actor.actorUserId,
        version: trx.raw('version + 1'),
        updated_at: trx.fn.now(),
      });
    if (visit.kind === 'corrective') {
      // The homeowner's report is answered by this call-out.
      await trx('fault_reports')
        .where({ visit_id: visitId })
        .whereNot({ status: 'closed' })
        .update({
          status: 'closed',
          closing_note: `Call-out done on ${ukDateOf(new Date(input.completedAt))}. ${outcome.words}`,
          version: trx.raw('version + 1'),
          updated_at: trx.fn.now(),
        });
    }
    // Queued with the completion itself, so no completed visit is ever left without its report.
    await queueServiceReport(trx, { visitId, siteId: visit.site_id });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'service_visit.completed',
      entityType: 'service_visit',
      entityId: visitId,
      organisationId: visit.installer_id,
      summary: `Completed: ${VISIT_KIND_LABELS[visit.kind]} at ${visit.site_reference}. ${outcome.words}`,
      changes: {
        status: { from: visit.status, to: 'done' },
        completedAt: { to: input.completedAt },
        findings: { to: outcome.findings },
      },
    });
  });
  return completedVisitOf(db, (await findVisit(db, visitId))!, today);
}

function refuseUnlessOpen(visit: Pick<VisitListRow, 'status'>) {
  if (visit.status === 'done')
    throw new ConflictError(
      'This visit is already completed. A completed visit is not changed: book another visit for further work.',
    );
  if (visit.status === 'cancelled')
    throw new ConflictError(
      'This visit was cancelled. Ask the office to book it again before completing it.',
    );
}
