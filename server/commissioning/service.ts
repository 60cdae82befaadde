import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { classifyReading, STATE_NAMES, type Band } from '../calc/loop';
import { formatOhms } from '../calc/notation';
import { ROMAN } from '../calc/grade';
import { loopDesignFor, siteEngineering } from '../engineering/site-engineering';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors';
import type { SiteAccess } from '../sites/access';
import { findSystemRow } from '../systems/repository';
import { listZones } from '../zones/repository';
import type { Zone } from '../zones/schema';
import {
  findWalkTestByKey,
  latestSitingChecks,
  latestSystemTests,
  latestWalkTests,
  toWalkTest,
  type WalkTestRow,
} from './repository';
import {
  BATTERY_MIN_LOADED_VOLTS,
  BATTERY_MIN_RESTING_VOLTS,
  SITING_ITEMS,
  type PreIssueCheck,
  type PreIssueProblem,
  type sitingCheckInputSchema,
  type systemTestInputSchema,
  type walkTestInputSchema,
} from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

const describeReading = (ohms: number) => (Number.isFinite(ohms) ? formatOhms(ohms) : 'open (OL)');
const describeBand = (band: Band) =>
  Number.isFinite(band.highOhms)
    ? `${formatOhms(band.lowOhms)} to ${formatOhms(band.highOhms)}`
    : `above ${formatOhms(band.lowOhms)}`;

/** The walk-test verdict in plain words, one line per reason it failed. */
export function walkTestFailures(
  secure: ReturnType<typeof classifyReading>,
  secureOhms: number,
  alarm: ReturnType<typeof classifyReading> | null,
  alarmOhms: number | null,
  activated: boolean,
): string[] {
  const failures: string[] = [];
  if (!activated) failures.push('The panel did not show the zone when the detector was walked.');
  if (secure.state !== 'normal') {
    failures.push(
      secure.state === 'out_of_tolerance'
        ? `The secure reading (${describeReading(secureOhms)}) is out of tolerance: nearest is ${STATE_NAMES[secure.band.state].toLowerCase()}, ${describeBand(secure.band)}.`
        : `The secure reading (${describeReading(secureOhms)}) reads as ${STATE_NAMES[secure.state].toLowerCase()}, not normal.`,
    );
  }
  // Every wiring has an alarm band; on two-resistor loops an open reading is a cut, not an alarm.
  if (alarm && alarmOhms !== null && alarm.state !== 'alarm') {
    failures.push(
      `The alarm reading (${describeReading(alarmOhms)}) reads as ${STATE_NAMES[alarm.state].toLowerCase()}, not alarm.`,
    );
  }
  return failures;
}

async function zoneOfSite(db: Knex, siteId: string, zoneId: string) {
  const system = await findSystemRow(db, siteId);
  if (!system) throw new ConflictError('Record the system and its zones before commissioning.');
  const zone = (await listZones(db, system.id)).find((candidate) => candidate.id === zoneId);
  if (!zone)
    throw new ValidationError([
      { path: 'body.zoneId', message: 'That zone is not on this site’s schedule.' },
    ]);
  return { system, zone };
}

/**
 * Records one walk test, classifying both readings against the zone's loop design. Sent twice
 * with the same key (a retry after a dropped connection), it is recorded once.
 */
export async function recordWalkTest(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof walkTestInputSchema>,
  actor: Actor,
) {
  const previous = await findWalkTestByKey(db, input.clientKey);
  if (previous) {
    if (previous.zone_id !== input.zoneId)
      throw new ConflictError('That record key was already used for another zone.');
    return { created: false, walkTest: toWalkTest(previous) };
  }
  const { system, zone } = await zoneOfSite(db, access.id, input.zoneId);
  const design = loopDesignFor(zone, system);
  let secure: ReturnType<typeof classifyReading>;
  try {
    secure = classifyReading(design, input.secureReading);
  } catch (error) {
    throw new ValidationError([
      {
        path: 'body.zoneId',
        message: `This zone’s loop is not fully recorded: ${(error as Error).message}`,
      },
    ]);
  }
  const alarm = input.alarmReading === null ? null : classifyReading(design, input.alarmReading);
  const failures = walkTestFailures(
    secure,
    input.secureReading,
    alarm,
    input.alarmReading,
    input.activated,
  );
  const testedAt = input.testedAt ? new Date(input.testedAt) : new Date();
  if (testedAt.getTime() > Date.now() + 5 * 60 * 1000) {
    throw new ValidationError([
      {
        path: 'body.testedAt',
        message: 'A test cannot be dated in the future; check the phone’s clock.',
      },
    ]);
  }

  const row = await db.transaction(async (trx) => {
    const [inserted] = await trx('walk_tests')
      .insert({
        zone_id: zone.id,
        client_key: input.clientKey,
        secure_reading_ohms: Number.isFinite(input.secureReading) ? input.secureReading : null,
        secure_open: !Number.isFinite(input.secureReading),
        secure_state: secure.state,
        alarm_reading_ohms:
          input.alarmReading !== null && Number.isFinite(input.alarmReading)
            ? input.alarmReading
            : null,
        alarm_open: input.alarmReading !== null && !Number.isFinite(input.alarmReading),
        alarm_state: alarm?.state ?? null,
        activated: input.activated,
        passed: failures.length === 0,
        failures: JSON.stringify(failures),
        note: input.note,
        tested_by: actor.actorUserId,
        tested_at: testedAt,
      })
      .returning<WalkTestRow[]>('*');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'walk_test.recorded',
      entityType: 'zone',
      entityId: zone.id,
      organisationId: access.installerId,
      summary: `Walk test of zone ${zone.number} (${zone.location}): ${failures.length === 0 ? 'passed' : 'failed'}, secure ${describeReading(input.secureReading)} ${STATE_NAMES[secure.state].toLowerCase()}`,
    });
    return inserted!;
  });
  return {
    created: true,
    walkTest: toWalkTest({ ...row, tested_by_name: actor.actorLabel ?? null }),
  };
}

export async function recordSitingCheck(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof sitingCheckInputSchema>,
  actor: Actor,
) {
  const existing = await db('siting_checks').where({ client_key: input.clientKey }).first();
  if (existing) return { created: false, allClear: existing.all_clear as boolean };
  const { zone } = await zoneOfSite(db, access.id, input.zoneId);
  const allClear = SITING_ITEMS.every((item) => input.answers[item]);
  await db.transaction(async (trx) => {
    await trx('siting_checks').insert({
      zone_id: zone.id,
      client_key: input.clientKey,
      answers: JSON.stringify(input.answers),
      all_clear: allClear,
      note: input.note,
      checked_by: actor.actorUserId,
      checked_at: input.testedAt ? new Date(input.testedAt) : new Date(),
    });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'siting.checked',
      entityType: 'zone',
      entityId: zone.id,
      organisationId: access.installerId,
      summary: `Siting of zone ${zone.number} (${zone.location}) checked: ${allClear ? 'all clear' : 'needs attention'}`,
    });
  });
  return { created: true, allClear };
}

export async function recordSystemTest(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof systemTestInputSchema>,
  actor: Actor,
) {
  const existing = await db('system_tests').where({ client_key: input.clientKey }).first();
  if (existing) return { created: false, passed: existing.passed as boolean };
  const system = await findSystemRow(db, access.id);
  if (!system) throw new ConflictError('Record the system before testing it.');
  const { clientKey, testedAt, note, kind, ...details } = input;
  let passed: boolean;
  switch (input.kind) {
    case 'sounders':
      passed = input.internalSounded && input.externalSounded;
      break;
    case 'signalling':
      passed = input.receivedByCentre;
      break;
    case 'battery':
      passed =
        input.restingVolts >= BATTERY_MIN_RESTING_VOLTS &&
        input.loadVolts >= BATTERY_MIN_LOADED_VOLTS;
      break;
  }
  await db.transaction(async (trx) => {
    await trx('system_tests').insert({
      system_id: system.id,
      client_key: clientKey,
      kind,
      passed,
      details: JSON.stringify({ ...details, note }),
      tested_by: actor.actorUserId,
      tested_at: testedAt ? new Date(testedAt) : new Date(),
    });
    await recordAuditEntry(trx, {
      ...actor,
      action: `system_test.${kind}`,
      entityType: 'system',
      entityId: system.id,
      organisationId: access.installerId,
      summary: `${kind[0]!.toUpperCase()}${kind.slice(1)} test ${passed ? 'passed' : 'failed'}`,
      changes: { details: { to: details } },
    });
  });
  return { created: true, passed };
}

const MOTION_DETECTORS: Zone['detectorKind'][] = ['pir', 'dual_technology'];

/**
 * Everything that stands between this system and a handover pack, in plain words. Blocking
 * problems must be fixed (or, in the handover issue, accepted by the customer as a variation).
 */
export async function preIssueCheck(db: Knex, siteId: string): Promise<PreIssueCheck> {
  const problems: PreIssueProblem[] = [];
  const block = (code: string, message: string, zoneId: string | null = null) =>
    problems.push({ code, severity: 'blocking', message, zoneId });
  const advise = (code: string, message: string, zoneId: string | null = null) =>
    problems.push({ code, severity: 'advice', message, zoneId });

  const site = await db('sites').where({ id: siteId }).first();
  if (!site) throw new NotFoundError();
  const system = await findSystemRow(db, siteId);
  if (!system) {
    block('no_system', 'The control panel, power supply and zones are not recorded yet.');
    return { clear: false, problems };
  }
  const [engineering, zones, walkTests, siting, systemTests, keyholders] = await Promise.all([
    siteEngineering(db, siteId),
    listZones(db, system.id),
    latestWalkTests(db, system.id),
    latestSitingChecks(db, system.id),
    latestSystemTests(db, system.id),
    db('keyholders').where({ site_id: siteId }).count<{ count: number }[]>('* as count'),
  ]);

  if (zones.length === 0) block('no_zones', 'No zones are on the schedule.');
  const walkByZone = new Map(walkTests.map((test) => [test.zone_id, test]));
  const sitingByZone = new Map(siting.map((check) => [check.zone_id, check]));
  for (const zone of zones) {
    const name = `Zone ${zone.number} (${zone.location})`;
    const designProblems =
      engineering?.zones.find((entry) => entry.zoneId === zone.id)?.problems ?? [];
    for (const problem of designProblems) block('loop_design', `${name}: ${problem}`, zone.id);
    const test = walkByZone.get(zone.id);
    if (!test) block('untested_zone', `${name} has not been walk-tested.`, zone.id);
    else if (!test.passed) {
      const reason =
        test.secure_state === 'out_of_tolerance'
          ? 'its secure reading is out of tolerance'
          : test.secure_state !== 'normal'
            ? `its secure reading showed ${STATE_NAMES[test.secure_state].toLowerCase()}`
            : !test.activated
              ? 'the panel did not show it when walked'
              : 'its alarm reading was wrong';
      block(
        'failed_walk_test',
        `${name} failed its last walk test: ${reason}. Put it right and test it again.`,
        zone.id,
      );
    }
    if (MOTION_DETECTORS.includes(zone.detectorKind)) {
      const check = sitingByZone.get(zone.id);
      if (!check)
        advise('siting_unchecked', `${name}: the siting checklist has not been done.`, zone.id);
      else if (!check.all_clear)
        advise(
          'siting_issue',
          `${name}: the siting checklist found something to put right.`,
          zone.id,
        );
    }
  }

  const testsByKind = new Map(systemTests.map((test) => [test.kind, test]));
  const needTest = (kind: 'sounders' | 'signalling' | 'battery', words: string) => {
    const test = testsByKind.get(kind);
    if (!test) block(`${kind}_untested`, `The ${words} test has not been done.`);
    else if (!test.passed) block(`${kind}_failed`, `The last ${words} test failed.`);
  };
  needTest('sounders', 'sounder');
  needTest('battery', 'battery');
  const monitored = site.monitoring_centre_id !== null;
  if (monitored) needTest('signalling', 'signalling');

  if (engineering) {
    if (!engineering.power.available)
      block('power_unknown', `The battery cannot be checked: ${engineering.power.reason}`);
    else if (engineering.power.passes === null)
      block('battery_unrecorded', 'The fitted battery’s capacity is not recorded.');
    else if (!engineering.power.passes) {
      block(
        'battery_too_small',
        `The battery is too small: ${engineering.power.requiredAh} Ah is needed (${engineering.power.working}) but ${engineering.power.batteryAh} Ah is fitted.`,
      );
    }
    const { grade } = engineering;
    if (grade.grade !== null && grade.grade < site.required_grade) {
      block(
        'grade_below_required',
        `The system is grade ${grade.grade} (set by ${grade.limitedBy.slice(0, 3).join(', ')}${grade.limitedBy.length > 3 ? ' and others' : ''}) but the site needs grade ${site.required_grade}.`,
      );
    }
    if (grade.ungraded.length > 0) {
      advise(
        'ungraded_components',
        `${grade.ungraded.length} component(s) have no grade recorded, so the system grade is not confirmed.`,
      );
    }
    for (const mismatch of engineering.environmentalMismatches) {
      block(
        'environmental_class',
        `${mismatch.label} is class ${ROMAN[mismatch.environmentalClass]} but its location (${mismatch.why}) needs class ${ROMAN[mismatch.required]}.`,
      );
    }
  }

  const keyholderCount = Number(keyholders[0]?.count ?? 0);
  if (monitored && keyholderCount < 2) {
    block(
      'too_few_keyholders',
      `A monitored site needs at least two keyholders; it has ${keyholderCount}.`,
    );
  }
  const expectsPolice = monitored && site.urn_status !== 'none';
  if (expectsPolice && !site.police_urn) {
    block('no_urn', 'The site expects police response but has no police URN recorded.');
  }
  return { clear: !problems.some((problem) => problem.severity === 'blocking'), problems };
}

/** The commissioning page's data in one call. */
export async function commissioningOverview(db: Knex, siteId: string) {
  const system = await findSystemRow(db, siteId);
  if (!system) return { zones: [], systemTests: [], check: await preIssueCheck(db, siteId) };
  const [zones, walkTests, siting, systemTests, check] = await Promise.all([
    listZones(db, system.id),
    latestWalkTests(db, system.id),
    latestSitingChecks(db, system.id),
    latestSystemTests(db, system.id),
    preIssueCheck(db, siteId),
  ]);
  const walkByZone = new Map(walkTests.map((test) => [test.zone_id, test]));
  const sitingByZone = new Map(siting.map((item) => [item.zone_id, item]));
  return {
    zones: zones.map((zone) => {
      const siting = sitingByZone.get(zone.id);
      return {
        zone,
        lastWalkTest: walkByZone.has(zone.id) ? toWalkTest(walkByZone.get(zone.id)!) : null,
        siting: siting
          ? {
              allClear: siting.all_clear,
              answers: siting.answers,
              checkedAt: siting.checked_at.toISOString(),
            }
          : null,
      };
    }),
    systemTests: systemTests.map((test) => ({
      kind: test.kind,
      passed: test.passed,
      details: test.details,
      testedBy: test.tested_by_name,
      testedAt: test.tested_at.toISOString(),
    })),
    check,
  };
}
