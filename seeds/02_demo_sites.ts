import { createHash, randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { SeedContext } from '../server/db/migrate';
import { DEMO_ACCOUNTS, DEMO_INSTALLER, DEMO_MONITORING_CENTRE } from './data/demo-scenario';
import {
  DEMO_ORGANISATION_CONTACTS,
  DEMO_PHOTO,
  demoPdf,
  demoSitePlans,
  demoZones,
  KEYHOLDER_NAMES,
  seededRandom,
} from './data/demo-sites';

/**
 * The demo's encrypted panel: S-0004 (account 1015) sends DC-09 frames AES-128-encrypted with
 * this key (`npm run simulate -- --account 1015 --key …`). A published demo value: never use it
 * in a real panel.
 */
const DEMO_DC09_KEY = '00112233445566778899AABBCCDDEEFF';

/**
 * The demo installer's sites, once: only while the demo installer exists and no site has been
 * recorded by anyone yet.
 */
export async function seed(knex: Knex, context: SeedContext = {}): Promise<void> {
  const installer = await knex('organisations')
    .where(DEMO_INSTALLER)
    .first<{ id: string } | undefined>('id');
  const centre = await knex('organisations')
    .where(DEMO_MONITORING_CENTRE)
    .first<{ id: string } | undefined>('id');
  if (!installer || !centre) return;
  if (await knex('sites').first('id')) return;

  const userIdOf = async (role: string) => {
    const email = DEMO_ACCOUNTS.find((account) => account.role === role)!.email;
    return (await knex('users').where({ email }).first<{ id: string }>('id')).id;
  };
  const [engineerId, officeId, homeownerId, keyholderUserId] = await Promise.all(
    ['engineer', 'office', 'homeowner', 'keyholder'].map(userIdOf),
  );
  const random = seededRandom(7);
  const files: { key: string; bytes: Buffer }[] = [];

  await knex.transaction(async (trx) => {
    await trx('organisations')
      .where({ id: installer.id })
      .update(DEMO_ORGANISATION_CONTACTS.installer);
    await trx('organisations')
      .where({ id: centre.id })
      .update(DEMO_ORGANISATION_CONTACTS.monitoring_centre);

    for (const [index, plan] of demoSitePlans().entries()) {
      const [site] = await trx('sites')
        .insert({
          installer_id: installer.id,
          reference: `S-${String(index + 1).padStart(4, '0')}`,
          name: plan.name,
          premises_type: plan.premisesType,
          address_line1: plan.addressLine1,
          town: plan.town,
          postcode: plan.postcode,
          access_notes: plan.accessNotes,
          hazards: plan.hazards,
          risk_notes:
            plan.premisesType === 'commercial'
              ? 'Stock and cash on the premises overnight; insurer asks for a monitored system.'
              : 'Household contents; no previous break-ins reported.',
          required_grade: plan.grade,
          grade_rationale:
            plan.grade >= 3
              ? 'Higher-value goods and insurer requirement: grade 3 or above.'
              : 'Typical domestic risk: grade 2 (EN 50131-1 low-to-medium risk).',
          environmental_class: 2,
          police_urn:
            plan.monitored && plan.grade >= 2 && index % 3 !== 2
              ? `EM/${2026}/${1000 + index}`
              : null,
          urn_status:
            plan.monitored && index % 3 !== 2 ? (index === 5 ? 'warning' : 'active') : 'none',
          monitoring_centre_id: plan.monitored ? centre.id : null,
          monitoring_account: plan.monitored
            ? (0x1000 + index * 7).toString(16).toUpperCase()
            : null,
          // S-0001 stays plain, so the README's first `npm run simulate` works as written.
          dc09_key: plan.monitored && index === 3 ? DEMO_DC09_KEY : null,
          test_interval_minutes: index === 0 ? 24 * 60 : null,
        })
        .returning<{ id: string }[]>('id');
      const siteId = site!.id;
      await trx('site_engineers').insert({ site_id: siteId, user_id: engineerId });

      const [system] = await trx('systems')
        .insert({
          site_id: siteId,
          control_panel:
            plan.zones > 16
              ? 'Hard-wired 48-zone panel (invented model W48)'
              : 'Hybrid 16-zone panel (invented model W16)',
          firmware: `4.${random.int(0, 9)}.${random.int(0, 20)}`,
          panel_location:
            plan.premisesType === 'commercial'
              ? 'Stockroom, high on the left wall'
              : 'Cupboard under the stairs',
          psu_type: 'A',
          battery_ah: plan.zones > 16 ? 17 : 7,
          panel_grade: plan.grade,
          panel_quiescent_ma: plan.zones > 16 ? 180 : 110,
          panel_alarm_ma: plan.zones > 16 ? 260 : 160,
          notification: plan.monitored ? 'C' : 'A',
          mains_failure_signalled: plan.monitored,
        })
        .returning<{ id: string }[]>('id');
      const systemId = system!.id;
      const areaNames =
        plan.premisesType === 'commercial'
          ? ['Shop floor', 'Stockroom', 'Office']
          : ['Downstairs', 'Upstairs'];
      const areas = await trx('areas')
        .insert(
          areaNames.map((name, areaIndex) => ({
            system_id: systemId,
            number: areaIndex + 1,
            name,
          })),
        )
        .returning<{ id: string }[]>('id');
      if (plan.monitored) {
        await trx('signalling_paths').insert([
          {
            system_id: systemId,
            position: 1,
            bearer: 'ip',
            ats_category: 'DP2',
            description: 'Broadband router',
          },
          {
            system_id: systemId,
            position: 2,
            bearer: 'cellular',
            ats_category: 'DP2',
            description: 'Cellular backup',
          },
        ]);
      }

      const zones = demoZones(plan, 1000 + index);
      await trx('zones').insert(
        zones.map((zone, zoneIndex) => ({
          system_id: systemId,
          position: zoneIndex + 1,
          number: zone.number,
          location: zone.location,
          zone_type: zone.zoneType,
          detector_kind: zone.detectorKind,
          loop_wiring: zone.loopWiring,
          tamper_ohms: zone.tamperOhms,
          alarm_ohms: zone.alarmOhms,
          core_map: JSON.stringify(zone.coreMap),
          area_id: areas[zoneIndex < zones.length / 2 ? 0 : areas.length - 1]!.id,
          attributes: zone.attributes,
          grade: plan.grade,
          environmental_class: 2,
          quiescent_ma: zone.quiescentMa,
          alarm_ma: zone.alarmMa,
        })),
      );
      await trx('devices').insert([
        {
          system_id: systemId,
          position: 1,
          kind: 'keypad',
          location: 'Hall, by the front door',
          grade: plan.grade,
          environmental_class: 2,
          quiescent_ma: 40,
          alarm_ma: 60,
        },
        {
          system_id: systemId,
          position: 2,
          kind: 'external_sounder',
          location: 'Front elevation, under the eaves',
          grade: plan.grade,
          environmental_class: 4,
          quiescent_ma: 25,
          alarm_ma: 450,
        },
        {
          system_id: systemId,
          position: 3,
          kind: 'internal_sounder',
          location: 'Landing',
          grade: plan.grade,
          environmental_class: 2,
          quiescent_ma: 0,
          alarm_ma: 150,
        },
        ...(plan.monitored
          ? [
              {
                system_id: systemId,
                position: 4,
                kind: 'communicator',
                location: 'In the panel',
                grade: plan.grade,
                environmental_class: 2,
                quiescent_ma: 60,
                alarm_ma: 120,
              },
            ]
          : []),
      ]);

      // Call plans of one to four people; a few sites have only one, which the screens flag.
      const keyholderCount = index % 7 === 4 ? 1 : random.int(2, 4);
      await trx('keyholders').insert(
        Array.from({ length: keyholderCount }, (_, order) => ({
          site_id: siteId,
          call_order: order + 1,
          name: KEYHOLDER_NAMES[(index + order) % KEYHOLDER_NAMES.length],
          phone: `+447700900${String(300 + ((index * 4 + order) % 600)).padStart(3, '0')}`,
          relation: random.pick(['Neighbour', 'Daughter', 'Son', 'Friend', 'Business partner']),
          minutes_to_attend: random.pick([5, 10, 15, 20, 25]),
          last_confirmed_at: order === 0 ? trx.raw(`now() - interval '40 days'`) : null,
        })),
      );
      await trx('user_code_slots').insert([
        {
          site_id: siteId,
          slot: 1,
          holder_name: 'Installer engineer',
          access_level: 3,
          changed_by: officeId,
        },
        ...Array.from({ length: random.int(1, 4) }, (_, slotIndex) => ({
          site_id: siteId,
          slot: slotIndex + 2,
          holder_name:
            slotIndex === 0
              ? plan.name.replace(' residence', ' (main user)')
              : `User ${slotIndex + 1}`,
          access_level: 2,
          area_numbers: [1],
          changed_by: officeId,
        })),
      ]);

      if (context.storage && index < 6) {
        for (const [fileName, contentType, bytes] of [
          ['panel-photo.png', 'image/png', DEMO_PHOTO],
          ['survey-notes.pdf', 'application/pdf', demoPdf(`Survey notes - ${plan.name}`)],
        ] as const) {
          const id = randomUUID();
          const key = `sites/${siteId}/${id}`;
          files.push({ key, bytes });
          await trx('site_files').insert({
            id,
            site_id: siteId,
            storage_key: key,
            file_name: fileName,
            content_type: contentType,
            size_bytes: bytes.length,
            sha256: createHash('sha256').update(bytes).digest('hex'),
            description: contentType === 'image/png' ? 'Panel as fitted' : 'Survey notes',
            uploaded_by: engineerId,
          });
        }
      }

      // The demo homeowner owns the first two sites; the demo keyholder holds keys for three.
      if (index < 2) await trx('site_homeowners').insert({ site_id: siteId, user_id: homeownerId });
      if (index === 0 || index === 3 || index === 8) {
        await trx('keyholders').where({ site_id: siteId, call_order: 1 }).update({
          name: 'Sam Whitlock',
          email: 'sam.whitlock@example.com',
          phone: '+447700900232',
          relation: 'Neighbour',
          user_id: keyholderUserId,
        });
      }
    }
  });

  for (const file of files) await context.storage!.put(file.key, file.bytes);
}
