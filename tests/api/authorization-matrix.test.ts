import type { IncomingMessage } from 'node:http';
import type { Knex } from 'knex';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../server/users/roles';
import { listRoutes } from '../setup/routes';
import { createPerson } from '../setup/factories';
import { useSiteWorld, type SiteFixture, type SiteWorld } from '../setup/site-fixtures';
import { issuePackThroughApi, signDraftDirectly, waitForBuild } from '../setup/handover-fixtures';
import { signaturePng } from '../setup/signature-png';
import { alarmFromSite } from '../setup/monitoring-fixtures';

/**
 * Every route of the API, every role, against a record of their own and one of someone else's.
 * A route missing from MATRIX fails the first test: new routes cannot slip in unguarded.
 */
const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
/** A real issued pack (and the build that made it) on each side. */
const packs = {} as Record<Target, { packNumber: string; buildId: string }>;
/** An intruder alarm event on each side. */
const alarmEvents = {} as Record<Target, string>;
beforeAll(async () => {
  world = currentWorld();
  packs.own = await issuePackThroughApi(harness, db, world.own.siteId);
  packs.other = await issuePackThroughApi(harness, db, world.other.siteId);
  alarmEvents.own = await alarmFromSite(db, world.own.siteId);
  alarmEvents.other = await alarmFromSite(db, world.other.siteId);
});

type Target = 'own' | 'other';
interface Call {
  path: string;
  body?: unknown;
  file?: { name: string; bytes: Buffer };
  /** A server-sent event stream: read the status, then hang up. */
  stream?: boolean;
}
interface Entry {
  /**
   * Roles that may use the route on their own record; 'public' needs no sign-in; 'webhook'
   * needs no sign-in but a provider's signature (tests/api/keyholder-callout.test.ts).
   */
  allowed: readonly Role[] | 'public' | 'anyone-signed-in' | 'webhook';
  /** Whether the route addresses a record (site, organisation, home): someone else's is a 404. */
  scoped: boolean;
  call(target: Target, role: Role): Promise<Call>;
}

const STAFF = ['engineer', 'office'] as const;
const READERS = ['engineer', 'office', 'operator', 'homeowner'] as const;
const KEEPERS = ['engineer', 'office', 'homeowner'] as const;
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAIAAACQd1PeAAAADElEQVR4nGP4z8AAAAMBAQDJ/pLvAAAAAElFTkSuQmCC',
  'base64',
);

const site = (target: Target): SiteFixture => world[target];
const personOf = (role: Role) => world[role];
const version = async (table: string, where: Record<string, unknown>, column = 'version') =>
  ((await db(table).where(where).first(column)) as Record<string, number>)[column]!;

async function freshKeyholder(dbHandle: Knex, siteId: string, email: string | null = null) {
  const [row] = await dbHandle('keyholders')
    .insert({
      site_id: siteId,
      call_order: dbHandle.raw(
        '(select coalesce(max(call_order), 0) + 1 from keyholders where site_id = ?)',
        [siteId],
      ),
      name: 'Matrix Keyholder',
      phone: '+447700900555',
      email,
      minutes_to_attend: 10,
    })
    .returning<{ id: string }[]>('id');
  return row!.id;
}

/** A burglary event on the target's site, already taken by the (own) operator. */
async function takenEvent(target: Target, category = 'burglary') {
  const [row] = await db('alarm_events')
    .insert({
      site_id: site(target).siteId,
      account: `M${Date.now()}`,
      category,
      priority: category === 'hold_up' ? 1 : 3,
      status: 'taken',
      taken_by: world.operator.userId,
      taken_at: db.fn.now(),
      first_signal_at: db.fn.now(),
      last_signal_at: db.fn.now(),
    })
    .returning<{ id: string }[]>('id');
  return row!.id;
}

/** An open alarm the target's keyholder has been texted about. */
async function alertFor(target: Target) {
  const eventId = await takenEvent(target);
  const keyholder = await db('keyholders')
    .where({ id: site(target).keyholderId })
    .first('id', 'name', 'phone');
  await db('keyholder_messages').insert({
    event_id: eventId,
    keyholder_id: keyholder.id,
    call_order: 1,
    keyholder_name: keyholder.name,
    phone: keyholder.phone,
    body: 'Matrix alert.',
    reference: `MX${Math.random().toString(36).slice(2, 8).toUpperCase()}`,
    status: 'delivered',
  });
  return eventId;
}

async function freshSlot(siteId: string) {
  const [row] = await db('user_code_slots')
    .insert({
      site_id: siteId,
      slot: db.raw('(select coalesce(max(slot), 1) + 1 from user_code_slots where site_id = ?)', [
        siteId,
      ]),
      holder_name: 'Matrix user',
      access_level: 2,
    })
    .returning<{ id: string }[]>('id');
  return row!.id;
}

/** A call-out booked on the target's site, at version 1, for the office to move. */
async function freshVisit(target: Target) {
  const [row] = await db('service_visits')
    .insert({
      site_id: site(target).siteId,
      kind: 'corrective',
      due_date: new Date().toISOString().slice(0, 10),
      reported_fault: 'Matrix fault.',
    })
    .returning<{ id: string }[]>('id');
  return row!.id;
}

/** A completed visit on the target's site whose report has been drawn and stored. */
async function visitWithReport(target: Target) {
  const [visit] = await db('service_visits')
    .insert({
      site_id: site(target).siteId,
      kind: 'corrective',
      status: 'done',
      completed_at: new Date(Date.now() - 60_000),
      due_date: new Date().toISOString().slice(0, 10),
      reported_fault: 'Matrix fault.',
    })
    .returning<{ id: string }[]>('id');
  const key = `service-reports/${site(target).siteId}/${crypto.randomUUID()}`;
  await harness.storage.put(key, Buffer.from('%PDF-1.7 matrix'));
  await db('service_reports').insert({
    visit_id: visit!.id,
    site_id: site(target).siteId,
    status: 'done',
    pdf_key: key,
    size_bytes: 15,
  });
  return visit!.id;
}

async function freshFile(siteId: string, uploadedBy: string) {
  const key = `sites/${siteId}/${crypto.randomUUID()}`;
  await harness.storage.put(key, PNG);
  const [row] = await db('site_files')
    .insert({
      site_id: siteId,
      storage_key: key,
      file_name: 'matrix.png',
      content_type: 'image/png',
      size_bytes: PNG.length,
      sha256: 'matrix',
      uploaded_by: uploadedBy,
    })
    .returning<{ id: string }[]>('id');
  return row!.id;
}

/** A person's own organisation (the centre for operators), or the other site's. */
async function organisationFor(target: Target, role: Role) {
  const column = role === 'operator' ? 'monitoring_centre_id' : 'installer_id';
  const row = await db('sites')
    .where({ id: site(target).siteId })
    .first(column);
  return row[column] as string;
}

async function freshHomeowner(siteId: string) {
  const person = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
  await db('site_homeowners').insert({ site_id: siteId, user_id: person.userId });
  return person.userId;
}

const validSite = {
  name: 'Matrix house',
  premisesType: 'domestic',
  addressLine1: '2 Matrix Road',
  town: 'Eastmere',
  postcode: 'EM1 2AB',
  requiredGrade: 2,
  environmentalClass: 2,
};

async function draftOf(target: Target) {
  const siteId = site(target).siteId;
  await db('handover_drafts').insert({ site_id: siteId }).onConflict('site_id').ignore();
  return db('handover_drafts').where({ site_id: siteId }).first();
}
const clearCustomer = (target: Target) =>
  db('handover_drafts')
    .where({ site_id: site(target).siteId })
    .update({
      customer_signature: null,
      customer_name: null,
      customer_signed_via: null,
      customer_signed_at: null,
    });
/** A fresh signing request to the target site's homeowner, with the customer unsigned. */
async function openSigningRequest(target: Target) {
  // An issue in flight ends with the draft used up: wait for it, then take the fresh draft.
  await settleBuilds(target);
  const draft = await draftOf(target);
  await clearCustomer(target);
  const homeowner = target === 'own' ? world.homeowner : world.otherHomeowner;
  const [row] = await db('signing_requests')
    .insert({ draft_id: draft.id, homeowner_user_id: homeowner.userId, sent_to: homeowner.email })
    .returning<{ id: string }[]>('id');
  return row!.id;
}
/** Waits for any build still running on the site, so a new issue is not refused for it. */
async function settleBuilds(target: Target) {
  const { agent } = await harness.signedInAs(world.engineer.userId);
  const running = await db('pack_builds')
    .where({ site_id: site(target).siteId })
    .whereIn('status', ['queued', 'running'])
    .pluck('id');
  for (const id of running) await waitForBuild(agent, id);
}

const MATRIX: Record<string, Entry> = {
  'GET /api/health': {
    allowed: 'public',
    scoped: false,
    call: async () => ({ path: '/api/health' }),
  },
  'GET /api/me': {
    allowed: 'anyone-signed-in',
    scoped: false,
    call: async () => ({ path: '/api/me' }),
  },
  'GET /api/homes/:role': {
    allowed: ROLES,
    scoped: false,
    call: async (_target, role) => ({ path: `/api/homes/${role}` }),
  },
  'GET /api/organisations/:organisationId': {
    allowed: ['engineer', 'office', 'operator'],
    scoped: true,
    call: async (target, role) => ({
      path: `/api/organisations/${await organisationFor(target, role)}`,
    }),
  },
  'GET /api/organisations/:organisationId/members': {
    allowed: ['office', 'operator'],
    scoped: true,
    call: async (target, role) => ({
      path: `/api/organisations/${await organisationFor(target, role)}/members`,
    }),
  },
  'GET /api/organisations/:organisationId/audit': {
    allowed: ['office'],
    scoped: true,
    call: async (target, role) => ({
      path: `/api/organisations/${await organisationFor(target, role)}/audit`,
    }),
  },
  'GET /api/sites': {
    allowed: ['engineer', 'office', 'operator'],
    scoped: false,
    call: async () => ({ path: '/api/sites' }),
  },
  'POST /api/sites': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({ path: '/api/sites', body: validSite }),
  },
  'GET /api/monitoring-centres': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({ path: '/api/monitoring-centres' }),
  },
  'GET /api/sites/:siteId': {
    allowed: ['engineer', 'office', 'operator'],
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}` }),
  },
  'PATCH /api/sites/:siteId': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}`,
      body: {
        accessNotes: 'Matrix note',
        version: await version('sites', { id: site(target).siteId }),
      },
    }),
  },
  'PUT /api/sites/:siteId/engineers': {
    allowed: ['office'],
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/engineers`,
      body: { userIds: [world.engineer.userId] },
    }),
  },
  'POST /api/sites/:siteId/homeowners': {
    allowed: ['office'],
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/homeowners`,
      body: {
        displayName: 'Matrix Owner',
        email: `owner-${crypto.randomUUID().slice(0, 8)}@example.com`,
      },
    }),
  },
  'DELETE /api/sites/:siteId/homeowners/:userId': {
    allowed: ['office'],
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/homeowners/${await freshHomeowner(site(target).siteId)}`,
    }),
  },
  'GET /api/sites/:siteId/system': {
    allowed: READERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/system` }),
  },
  'PUT /api/sites/:siteId/system': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/system`,
      body: {
        controlPanel: 'Matrix panel',
        version: await version('systems', { site_id: site(target).siteId }),
      },
    }),
  },
  'GET /api/sites/:siteId/zones': {
    allowed: READERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/zones` }),
  },
  'PUT /api/sites/:siteId/zones': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/zones`,
      body: {
        zonesVersion: await version('systems', { site_id: site(target).siteId }, 'zones_version'),
        zones: site(target).zoneIds.map((id, index) => ({
          id,
          number: index + 1,
          location: `Room ${index + 1}`,
          zoneType: 'instant',
          detectorKind: 'pir',
          loopWiring: 'two_resistor',
          tamperOhms: 2200,
          alarmOhms: 4700,
        })),
      },
    }),
  },
  'GET /api/sites/:siteId/devices': {
    allowed: READERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/devices` }),
  },
  'PUT /api/sites/:siteId/devices': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/devices`,
      body: {
        devicesVersion: await version(
          'systems',
          { site_id: site(target).siteId },
          'devices_version',
        ),
        devices: [{ kind: 'keypad', location: 'Hall' }],
      },
    }),
  },
  'GET /api/sites/:siteId/keyholders': {
    allowed: READERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/keyholders` }),
  },
  'POST /api/sites/:siteId/keyholders': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/keyholders`,
      body: { name: 'New Keyholder', phone: '07700 900123', minutesToAttend: 12 },
    }),
  },
  'PUT /api/sites/:siteId/keyholders/order': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/keyholders/order`,
      body: {
        keyholderIds: await db('keyholders')
          .where({ site_id: site(target).siteId })
          .orderBy('call_order', 'desc')
          .pluck('id'),
      },
    }),
  },
  'PATCH /api/sites/:siteId/keyholders/:keyholderId': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/keyholders/${site(target).keyholderId}`,
      body: {
        relation: 'Neighbour',
        version: await version('keyholders', { id: site(target).keyholderId }),
      },
    }),
  },
  'DELETE /api/sites/:siteId/keyholders/:keyholderId': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/keyholders/${await freshKeyholder(db, site(target).siteId)}`,
    }),
  },
  'POST /api/sites/:siteId/keyholders/:keyholderId/confirm': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/keyholders/${site(target).keyholderId}/confirm`,
    }),
  },
  'POST /api/sites/:siteId/keyholders/:keyholderId/invitation': {
    allowed: ['office', 'homeowner'],
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/keyholders/${await freshKeyholder(
        db,
        site(target).siteId,
        `kh-${crypto.randomUUID().slice(0, 8)}@example.com`,
      )}/invitation`,
    }),
  },
  'GET /api/sites/:siteId/user-slots': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/user-slots` }),
  },
  'POST /api/sites/:siteId/user-slots': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/user-slots`,
      body: {
        slot:
          Number(
            await db('user_code_slots')
              .where({ site_id: site(target).siteId })
              .max('slot as m')
              .first()
              .then((r) => r!.m),
          ) + 1,
        holderName: 'Cleaner',
        accessLevel: 2,
      },
    }),
  },
  'PATCH /api/sites/:siteId/user-slots/:slotId': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/user-slots/${site(target).slotId}`,
      body: {
        holderName: 'Renamed',
        version: await version('user_code_slots', { id: site(target).slotId }),
      },
    }),
  },
  'DELETE /api/sites/:siteId/user-slots/:slotId': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/user-slots/${await freshSlot(site(target).siteId)}`,
    }),
  },
  'GET /api/sites/:siteId/files': {
    allowed: READERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/files` }),
  },
  'POST /api/sites/:siteId/files': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/files`,
      file: { name: 'photo.png', bytes: PNG },
    }),
  },
  'GET /api/sites/:siteId/files/:fileId/content': {
    allowed: READERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/files/${await freshFile(site(target).siteId, world.engineer.userId)}/content`,
    }),
  },
  'DELETE /api/sites/:siteId/files/:fileId': {
    allowed: KEEPERS,
    scoped: true,
    // Uploaded by the person asking, so a homeowner may remove it too.
    call: async (target, role) => ({
      path: `/api/sites/${site(target).siteId}/files/${await freshFile(site(target).siteId, personOf(role).userId)}`,
    }),
  },
  'GET /api/sites/:siteId/change-requests': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/change-requests` }),
  },
  'POST /api/sites/:siteId/change-requests': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/change-requests`,
      body: { subject: 'Move the keypad', details: 'Closer to the front door, please.' },
    }),
  },
  'PATCH /api/sites/:siteId/change-requests/:requestId': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/change-requests/${site(target).changeRequestId}`,
      body: { status: 'closed' },
    }),
  },
  'POST /api/calc/resistance': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({ path: '/api/calc/resistance', body: { value: '2K2' } }),
  },
  'POST /api/calc/loop': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({
      path: '/api/calc/loop',
      body: { wiring: 'two_resistor', tamperOhms: '2k2', alarmOhms: '4k7', reading: '2200' },
    }),
  },
  'POST /api/calc/cable': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({
      path: '/api/calc/cable',
      body: { core: '7/0.2', runMetres: 50, currentMa: 30 },
    }),
  },
  'POST /api/calc/power-budget': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({
      path: '/api/calc/power-budget',
      body: {
        items: [{ label: 'Panel', quiescentMa: 100, alarmMa: 200 }],
        grade: 2,
        psuType: 'A',
        batteryAh: 7,
      },
    }),
  },
  'POST /api/calc/grade': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({
      path: '/api/calc/grade',
      body: { components: [{ label: 'Panel', grade: 3 }] },
    }),
  },
  'GET /api/sites/:siteId/engineering': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/engineering` }),
  },
  'GET /api/sites/:siteId/commissioning': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/commissioning` }),
  },
  'GET /api/sites/:siteId/pre-issue-check': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/pre-issue-check` }),
  },
  'POST /api/sites/:siteId/walk-tests': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/walk-tests`,
      body: {
        clientKey: crypto.randomUUID(),
        zoneId: site(target).zoneIds[0],
        secureReading: '2k2',
        activated: true,
      },
    }),
  },
  'POST /api/sites/:siteId/siting-checks': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/siting-checks`,
      body: {
        clientKey: crypto.randomUUID(),
        zoneId: site(target).zoneIds[0],
        answers: {
          not_facing_windows: true,
          away_from_heat: true,
          out_of_direct_sun: true,
          away_from_draughts: true,
          clear_of_insects_and_pets: true,
          height_and_angle: true,
        },
      },
    }),
  },
  'POST /api/sites/:siteId/system-tests': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/system-tests`,
      body: {
        clientKey: crypto.randomUUID(),
        kind: 'sounders',
        internalSounded: true,
        externalSounded: true,
        strobeFlashed: true,
      },
    }),
  },
  'GET /api/sites/:siteId/handover': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/handover` }),
  },
  'PUT /api/sites/:siteId/handover/variations': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/handover/variations`,
      body: {
        variations: ['The garage is left unprotected at the customer’s wish.'],
        version: null,
      },
    }),
  },
  'GET /api/sites/:siteId/handover/preview.pdf': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/handover/preview.pdf` }),
  },
  'POST /api/sites/:siteId/handover/signatures/engineer': {
    allowed: ['engineer'],
    scoped: true,
    call: async (target) => {
      await db('handover_drafts')
        .where({ site_id: site(target).siteId })
        .update({ engineer_signature: null, engineer_name: null, engineer_signed_at: null });
      return {
        path: `/api/sites/${site(target).siteId}/handover/signatures/engineer`,
        body: { image: signaturePng() },
      };
    },
  },
  'POST /api/sites/:siteId/handover/signatures/customer': {
    allowed: ['engineer'],
    scoped: true,
    call: async (target) => {
      await clearCustomer(target);
      return {
        path: `/api/sites/${site(target).siteId}/handover/signatures/customer`,
        body: { name: 'Matrix Customer', image: signaturePng() },
      };
    },
  },
  'DELETE /api/sites/:siteId/handover/signatures': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/handover/signatures` }),
  },
  'POST /api/sites/:siteId/handover/signing-request': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => {
      await clearCustomer(target);
      return {
        path: `/api/sites/${site(target).siteId}/handover/signing-request`,
        body: { homeownerUserId: world.homeowner.userId },
      };
    },
  },
  'POST /api/sites/:siteId/handover/issue': {
    allowed: ['engineer'],
    scoped: true,
    call: async (target) => {
      if (target === 'own') {
        await settleBuilds(target);
        await signDraftDirectly(db, site(target).siteId, world.engineer.userId);
      }
      return { path: `/api/sites/${site(target).siteId}/handover/issue` };
    },
  },
  'GET /api/handover-builds/:buildId': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({ path: `/api/handover-builds/${packs[target].buildId}` }),
  },
  'GET /api/packs/:packNumber/pdf': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({ path: `/api/packs/${packs[target].packNumber}/pdf` }),
  },
  'POST /api/packs/:packNumber/revoke': {
    allowed: ['office'],
    scoped: true,
    call: async (target) => ({
      path: `/api/packs/${packs[target].packNumber}/revoke`,
      body: { reason: 'Matrix check.' },
    }),
  },
  'GET /api/verify/:packNumber': {
    allowed: 'public',
    scoped: false,
    call: async () => ({ path: `/api/verify/${packs.own.packNumber}` }),
  },
  'POST /api/verify/:packNumber/check': {
    allowed: 'public',
    scoped: false,
    call: async () => ({
      path: `/api/verify/${packs.own.packNumber}/check`,
      body: Buffer.from('%PDF-1.3 not the pack'),
    }),
  },
  'GET /api/seal-keys': {
    allowed: 'public',
    scoped: false,
    call: async () => ({ path: '/api/seal-keys' }),
  },
  'GET /api/my/documents': {
    allowed: ['homeowner'],
    scoped: false,
    call: async () => ({ path: '/api/my/documents' }),
  },
  'GET /api/my/signing-requests/:requestId': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({
      path: `/api/my/signing-requests/${await openSigningRequest(target)}`,
    }),
  },
  'GET /api/my/signing-requests/:requestId/preview.pdf': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({
      path: `/api/my/signing-requests/${await openSigningRequest(target)}/preview.pdf`,
    }),
  },
  'POST /api/my/signing-requests/:requestId/sign': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({
      path: `/api/my/signing-requests/${await openSigningRequest(target)}/sign`,
      body: { name: 'Matrix Homeowner', image: signaturePng() },
    }),
  },
  'GET /api/organisation/pack-settings': {
    allowed: ['office'],
    scoped: false,
    call: async () => ({ path: '/api/organisation/pack-settings' }),
  },
  'PUT /api/organisation/pack-settings': {
    allowed: ['office'],
    scoped: false,
    call: async () => {
      const installer = await db('organisations').where({ id: world.installer.id }).first();
      return { path: '/api/organisation/pack-settings', body: { prefix: installer.pack_prefix } };
    },
  },
  'POST /api/organisation/seal-keys/rotate': {
    allowed: ['office'],
    scoped: false,
    call: async () => ({ path: '/api/organisation/seal-keys/rotate' }),
  },
  'GET /api/monitoring/events': {
    allowed: ['operator'],
    scoped: false,
    call: async () => ({ path: '/api/monitoring/events' }),
  },
  'GET /api/monitoring/stream': {
    allowed: ['operator'],
    scoped: false,
    call: async () => ({ path: '/api/monitoring/stream', stream: true }),
  },
  'GET /api/monitoring/events/:eventId': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({ path: `/api/monitoring/events/${alarmEvents[target]}` }),
  },
  'POST /api/monitoring/events/:eventId/take': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({ path: `/api/monitoring/events/${alarmEvents[target]}/take` }),
  },
  'POST /api/monitoring/events/:eventId/close': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({
      path: `/api/monitoring/events/${alarmEvents[target]}/close`,
      body: { outcome: 'test_or_engineer', note: 'Matrix check.' },
    }),
  },
  // Clearing the key keeps the sites' panels on plain frames for the rest of this file.
  'PUT /api/monitoring/sites/:siteId/signalling-credentials': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({
      path: `/api/monitoring/sites/${site(target).siteId}/signalling-credentials`,
      body: { dc09Key: null },
    }),
  },
  'POST /api/monitoring/sites/:siteId/intake-token': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({ path: `/api/monitoring/sites/${site(target).siteId}/intake-token` }),
  },
  'POST /api/monitoring/events/:eventId/call-out': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({
      path: `/api/monitoring/events/${await takenEvent(target)}/call-out`,
      body: {},
    }),
  },
  'POST /api/monitoring/events/:eventId/calls': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => ({
      path: `/api/monitoring/events/${await takenEvent(target)}/calls`,
      body: { position: 1, result: 'no_answer', note: 'Matrix call.' },
    }),
  },
  'POST /api/monitoring/events/:eventId/police': {
    allowed: ['operator'],
    scoped: true,
    call: async (target) => {
      await db('sites')
        .where({ id: site(target).siteId })
        .update({ police_urn: 'MX/0001/26', urn_status: 'active' });
      return {
        path: `/api/monitoring/events/${await takenEvent(target, 'hold_up')}/police`,
        body: { incidentReference: 'MATRIX 1' },
      };
    },
  },
  'GET /api/monitoring/figures': {
    allowed: ['operator'],
    scoped: false,
    call: async () => ({ path: '/api/monitoring/figures' }),
  },
  'POST /api/webhooks/twilio/status': {
    allowed: 'webhook',
    scoped: false,
    call: async () => ({
      path: `/api/webhooks/twilio/status?message=${crypto.randomUUID()}`,
      body: { MessageSid: `SM${'0'.repeat(32)}`, MessageStatus: 'delivered' },
    }),
  },
  'POST /api/webhooks/twilio/inbound': {
    allowed: 'webhook',
    scoped: false,
    call: async () => ({
      path: '/api/webhooks/twilio/inbound',
      body: { From: '+447700900555', Body: '1' },
    }),
  },
  'GET /api/my/alerts': {
    allowed: ['keyholder'],
    scoped: false,
    call: async () => ({ path: '/api/my/alerts' }),
  },
  'POST /api/my/alerts/:eventId/response': {
    allowed: ['keyholder'],
    scoped: true,
    call: async (target) => ({
      path: `/api/my/alerts/${await alertFor(target)}/response`,
      body: { response: 'attending' },
    }),
  },
  'GET /api/my/homes/:siteId/signals': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({ path: `/api/my/homes/${site(target).siteId}/signals` }),
  },
  'GET /api/sites/:siteId/false-alarms': {
    allowed: ['engineer', 'office', 'operator'],
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/false-alarms` }),
  },
  'GET /api/my/homes': {
    allowed: ['homeowner'],
    scoped: false,
    call: async () => ({ path: '/api/my/homes' }),
  },
  'GET /api/my/homes/:siteId': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({ path: `/api/my/homes/${site(target).siteId}` }),
  },
  'GET /api/my/keyholdings': {
    allowed: ['keyholder'],
    scoped: false,
    call: async () => ({ path: '/api/my/keyholdings' }),
  },
  'GET /api/sites/:siteId/service-plan': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({ path: `/api/sites/${site(target).siteId}/service-plan` }),
  },
  'POST /api/sites/:siteId/service/visits': {
    allowed: ['office'],
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/service/visits`,
      body: { kind: 'corrective', reportedFault: 'Matrix fault.' },
    }),
  },
  'GET /api/service/visits': {
    allowed: STAFF,
    scoped: false,
    call: async () => ({ path: '/api/service/visits' }),
  },
  'PATCH /api/service/visits/:visitId': {
    allowed: ['office'],
    scoped: true,
    call: async (target) => ({
      path: `/api/service/visits/${await freshVisit(target)}`,
      body: { version: 1, dueDate: new Date().toISOString().slice(0, 10) },
    }),
  },
  'GET /api/service/overdue': {
    allowed: ['office'],
    scoped: false,
    call: async () => ({ path: '/api/service/overdue' }),
  },
  'POST /api/sites/:siteId/service/callouts': {
    allowed: STAFF,
    scoped: true,
    call: async (target) => ({
      path: `/api/sites/${site(target).siteId}/service/callouts`,
      body: { reportedFault: 'Matrix call-out by phone.' },
    }),
  },
  'POST /api/service/visits/:visitId/complete': {
    allowed: ['engineer'],
    scoped: true,
    call: async (target) => ({
      path: `/api/service/visits/${await freshVisit(target)}/complete`,
      body: {
        kind: 'corrective',
        clientKey: crypto.randomUUID(),
        completedAt: new Date(Date.now() - 60_000).toISOString(),
        primeCause: 'equipment_fault',
        actionTaken: 'Matrix repair.',
        falseAlarm: false,
      },
    }),
  },
  'POST /api/my/homes/:siteId/faults': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({
      path: `/api/my/homes/${site(target).siteId}/faults`,
      body: { description: 'Matrix fault report.' },
    }),
  },
  'GET /api/service/faults': {
    allowed: ['office'],
    scoped: false,
    call: async () => ({ path: '/api/service/faults' }),
  },
  'GET /api/my/homes/:siteId/service-history': {
    allowed: ['homeowner'],
    scoped: true,
    call: async (target) => ({ path: `/api/my/homes/${site(target).siteId}/service-history` }),
  },
  'GET /api/service/visits/:visitId/report.pdf': {
    allowed: KEEPERS,
    scoped: true,
    call: async (target) => ({
      path: `/api/service/visits/${await visitWithReport(target)}/report.pdf`,
    }),
  },
};

// Sign-in routes and the client's pages are outside the API; they have their own tests.
const NOT_API = (route: string) => !route.includes(' /api/');

function method(route: string) {
  return route.split(' ')[0]!.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
}

async function send(agent: request.Agent, csrfToken: string, route: string, call: Call) {
  const verb = method(route);
  let pending = agent[verb](call.path);
  if (verb !== 'get') pending = pending.set('x-csrf-token', csrfToken);
  if (call.file) return pending.attach('file', call.file.bytes, call.file.name);
  if (call.stream)
    return pending.buffer(false).parse((res, done) => {
      // In Node, superagent hands the parser the IncomingMessage itself.
      (res as unknown as IncomingMessage).destroy();
      done(null, null);
    });
  return call.body === undefined ? pending : pending.send(call.body as object);
}

describe('authorization matrix', () => {
  it('has an entry for every API route', () => {
    const apiRoutes = listRoutes(harness.app).filter((route) => !NOT_API(route));
    const missing = apiRoutes.filter((route) => !(route in MATRIX));
    expect(missing, 'routes without a matrix entry').toEqual([]);
    const stale = Object.keys(MATRIX).filter((route) => !apiRoutes.includes(route));
    expect(stale, 'matrix entries for routes that no longer exist').toEqual([]);
  });

  it('refuses every route to someone not signed in, except the public ones', async () => {
    for (const [route, entry] of Object.entries(MATRIX)) {
      const call = await entry.call('own', 'engineer');
      let pending = request(harness.app)[method(route)](call.path);
      // A public route is called as a visitor would: with its body.
      if (entry.allowed === 'public' && call.body !== undefined)
        pending = pending.send(call.body as object);
      const response = await pending;
      if (entry.allowed === 'public') expect(response.status, route).toBeLessThan(400);
      else if (entry.allowed === 'webhook') expect(response.status, route).toBe(403);
      // Writes without a session also lack a CSRF token; either refusal is right.
      else expect([401, 403], route).toContain(response.status);
    }
  });

  for (const role of ROLES) {
    it(`gives a ${role} exactly their routes, on their own records only`, async () => {
      const { agent, csrfToken } = await harness.signedInAs(personOf(role).userId);
      const outcomes: string[] = [];
      for (const [route, entry] of Object.entries(MATRIX)) {
        if (entry.allowed === 'public' || entry.allowed === 'webhook') continue;
        const allowed = entry.allowed === 'anyone-signed-in' || entry.allowed.includes(role);
        const own = await send(agent, csrfToken, route, await entry.call('own', role));
        const ownOk = allowed ? own.status >= 200 && own.status < 300 : own.status === 403;
        if (!ownOk)
          outcomes.push(`${route} own: ${own.status} ${JSON.stringify(own.body).slice(0, 200)}`);
        if (entry.scoped) {
          const other = await send(agent, csrfToken, route, await entry.call('other', role));
          // Someone else's record: 404 where the role could use the route, 403 where it never could.
          const expected = allowed ? 404 : [403, 404];
          const otherOk = Array.isArray(expected)
            ? expected.includes(other.status)
            : other.status === expected;
          if (!otherOk) outcomes.push(`${route} other: ${other.status}`);
        }
      }
      expect(outcomes, `unexpected answers for ${role}`).toEqual([]);
    });
  }

  it("never lists another installer's or centre's sites", async () => {
    for (const role of ['engineer', 'office', 'operator'] as const) {
      const { agent } = await harness.signedInAs(personOf(role).userId);
      const { body } = await agent.get('/api/sites?pageSize=100');
      const ids = body.items.map((item: { id: string }) => item.id);
      expect(ids, role).toContain(world.own.siteId);
      expect(ids, role).not.toContain(world.other.siteId);
    }
  });
});
