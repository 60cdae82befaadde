import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { afterAll, beforeAll } from 'vitest';
import { buildApiHarness, type ApiHarness } from './api-app';
import { closeTestDb, testDb } from './database';
import { createOrganisation, createPerson, type TestPerson } from './factories';

const tag = () => randomBytes(3).toString('hex');

export interface SiteFixture {
  siteId: string;
  systemId: string;
  zoneIds: string[];
  keyholderId: string;
  slotId: string;
  changeRequestId: string;
}

/** A site with a system, two zones, a keyholder, a user-code slot and a change request. */
export async function createSiteRecord(
  db: Knex,
  options: {
    installerId: string;
    monitoringCentreId?: string;
    homeownerId?: string;
    keyholderUserId?: string;
  },
): Promise<SiteFixture> {
  const [site] = await db('sites')
    .insert({
      installer_id: options.installerId,
      reference: `T-${tag()}`,
      name: `Test site ${tag()}`,
      premises_type: 'domestic',
      address_line1: '1 Test Street',
      town: 'Eastmere',
      postcode: 'EM1 1AA',
      required_grade: 2,
      environmental_class: 2,
      monitoring_centre_id: options.monitoringCentreId ?? null,
      monitoring_account: options.monitoringCentreId ? tag().toUpperCase() : null,
    })
    .returning<{ id: string }[]>('id');
  const siteId = site!.id;
  const [system] = await db('systems')
    .insert({ site_id: siteId, control_panel: 'Test panel' })
    .returning<{ id: string }[]>('id');
  const zones = await db('zones')
    .insert(
      [1, 2].map((number) => ({
        system_id: system!.id,
        position: number,
        number,
        location: `Room ${number}`,
        zone_type: number === 1 ? 'entry_exit' : 'instant',
        detector_kind: 'pir',
        loop_wiring: 'two_resistor',
        tamper_ohms: 2200,
        alarm_ohms: 4700,
      })),
    )
    .returning<{ id: string }[]>('id');
  const [keyholder] = await db('keyholders')
    .insert({
      site_id: siteId,
      call_order: 1,
      name: 'Test Keyholder',
      phone: '+447700900999',
      minutes_to_attend: 10,
      user_id: options.keyholderUserId ?? null,
    })
    .returning<{ id: string }[]>('id');
  const [slot] = await db('user_code_slots')
    .insert({ site_id: siteId, slot: 2, holder_name: 'Main user', access_level: 2 })
    .returning<{ id: string }[]>('id');
  if (options.homeownerId)
    await db('site_homeowners').insert({ site_id: siteId, user_id: options.homeownerId });
  const [request] = await db('change_requests')
    .insert({ site_id: siteId, subject: 'Extra detector', details: 'In the garage, please.' })
    .returning<{ id: string }[]>('id');
  return {
    siteId,
    systemId: system!.id,
    zoneIds: zones.map((zone) => zone.id),
    keyholderId: keyholder!.id,
    slotId: slot!.id,
    changeRequestId: request!.id,
  };
}

export interface SiteWorld {
  installer: { id: string; name: string };
  centre: { id: string; name: string };
  engineer: TestPerson;
  office: TestPerson;
  operator: TestPerson;
  homeowner: TestPerson;
  keyholder: TestPerson;
  /** A site of this installer, monitored by this centre, with the homeowner and keyholder. */
  own: SiteFixture;
  /** Someone else's: another installer, centre, homeowner and keyholder. */
  other: SiteFixture;
  otherHomeowner: TestPerson;
}

export async function createSiteWorld(db: Knex): Promise<SiteWorld> {
  const installer = await createOrganisation(db, 'installer');
  const centre = await createOrganisation(db, 'monitoring_centre');
  const rivalInstaller = await createOrganisation(db, 'installer');
  const rivalCentre = await createOrganisation(db, 'monitoring_centre');
  const [engineer, office, operator, homeowner, keyholder, otherHomeowner, otherKeyholder] =
    await Promise.all([
      createPerson(db, { memberships: [{ role: 'engineer', organisationId: installer.id }] }),
      createPerson(db, { memberships: [{ role: 'office', organisationId: installer.id }] }),
      createPerson(db, { memberships: [{ role: 'operator', organisationId: centre.id }] }),
      createPerson(db, { memberships: [{ role: 'homeowner' }] }),
      createPerson(db, { memberships: [{ role: 'keyholder' }] }),
      createPerson(db, { memberships: [{ role: 'homeowner' }] }),
      createPerson(db, { memberships: [{ role: 'keyholder' }] }),
    ]);
  const own = await createSiteRecord(db, {
    installerId: installer.id,
    monitoringCentreId: centre.id,
    homeownerId: homeowner.userId,
    keyholderUserId: keyholder.userId,
  });
  const other = await createSiteRecord(db, {
    installerId: rivalInstaller.id,
    monitoringCentreId: rivalCentre.id,
    homeownerId: otherHomeowner.userId,
    keyholderUserId: otherKeyholder.userId,
  });
  return {
    installer,
    centre,
    engineer,
    office,
    operator,
    homeowner,
    keyholder,
    own,
    other,
    otherHomeowner,
  };
}

/**
 * The usual set-up of an API test about site records: the app harness and a fresh world,
 * torn down after the file. Read both through the returned getters inside tests.
 */
export async function useSiteWorld(): Promise<{
  harness: ApiHarness;
  db: Knex;
  world: () => SiteWorld;
}> {
  const db = testDb();
  const harness = await buildApiHarness(db);
  let world: SiteWorld | undefined;
  beforeAll(async () => {
    world = await createSiteWorld(db);
  });
  afterAll(async () => {
    await harness.close();
    await closeTestDb();
  });
  return {
    harness,
    db,
    world: () => {
      if (!world) throw new Error('the site world is made in beforeAll');
      return world;
    },
  };
}
