import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser } from '../auth/current-user';
import { NotFoundError } from '../http/errors';
import { requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import type { Keyholding, MyHome } from './schema';

const homeParams = z.object({ siteId: z.uuid() });

const contact = (prefix: string) => [
  `${prefix}.name as ${prefix}_name`,
  `${prefix}.phone as ${prefix}_phone`,
  `${prefix}.out_of_hours_phone as ${prefix}_out_of_hours_phone`,
  `${prefix}.email as ${prefix}_email`,
];

type Row = Record<string, unknown>;
const toContact = (row: Row, prefix: string) =>
  row[`${prefix}_name`]
    ? {
        name: row[`${prefix}_name`] as string,
        phone: (row[`${prefix}_phone`] as string | null) ?? null,
        outOfHoursPhone: (row[`${prefix}_out_of_hours_phone`] as string | null) ?? null,
        email: (row[`${prefix}_email`] as string | null) ?? null,
      }
    : null;
const address = (row: Row) => ({
  addressLine1: row.address_line1 as string,
  addressLine2: row.address_line2 as string,
  town: row.town as string,
  postcode: row.postcode as string,
});

/** The homeowner's and keyholder's own views: shaped here so they carry nothing more. */
export function createMyRouter({ db }: { db: Knex }): Router {
  const router = Router();

  const homes = (userId: string) =>
    db('sites as s')
      .join('site_homeowners as sh', 'sh.site_id', 's.id')
      .join('organisations as i', 'i.id', 's.installer_id')
      .leftJoin('organisations as mc', 'mc.id', 's.monitoring_centre_id')
      .where('sh.user_id', userId)
      .orderBy('s.name')
      .select(
        's.id',
        's.reference',
        's.name',
        's.address_line1',
        's.address_line2',
        's.town',
        's.postcode',
        's.access_notes',
        's.hazards',
        's.required_grade',
        's.environmental_class',
        's.police_urn',
        's.urn_status',
        's.monitoring_account',
        ...contact('i'),
        ...contact('mc'),
        db.raw(
          `(select count(*)::int from zones z join systems sy on sy.id = z.system_id where sy.site_id = s.id) as zone_count`,
        ),
        db.raw(
          `(select count(*)::int from keyholders k where k.site_id = s.id) as keyholder_count`,
        ),
        db.raw(
          `(select count(*)::int from user_code_slots c where c.site_id = s.id) as slot_count`,
        ),
        db.raw(`(select count(*)::int from site_files f where f.site_id = s.id) as file_count`),
      );

  const toHome = (row: Row): MyHome => ({
    id: row.id as string,
    reference: row.reference as string,
    name: row.name as string,
    address: address(row),
    accessNotes: row.access_notes as string,
    hazards: row.hazards as string,
    requiredGrade: row.required_grade as number,
    environmentalClass: row.environmental_class as number,
    policeUrn: row.police_urn as string | null,
    urnStatus: row.urn_status as MyHome['urnStatus'],
    monitoringAccount: row.monitoring_account as string | null,
    installer: toContact(row, 'i')!,
    monitoringCentre: toContact(row, 'mc'),
    counts: {
      zones: row.zone_count as number,
      keyholders: row.keyholder_count as number,
      userSlots: row.slot_count as number,
      files: row.file_count as number,
    },
  });

  router.get('/api/my/homes', requireRole('homeowner'), async function myHomes(req, res) {
    const rows = await homes(currentUser(req).id);
    res.json({ homes: rows.map(toHome) });
  });

  router.get('/api/my/homes/:siteId', requireRole('homeowner'), async function myHome(req, res) {
    const { siteId } = parseRequest(homeParams, req.params, 'params');
    const [row] = await homes(currentUser(req).id).where('s.id', siteId);
    if (!row) throw new NotFoundError();
    res.json(toHome(row));
  });

  router.get(
    '/api/my/keyholdings',
    requireRole('keyholder'),
    async function myKeyholdings(req, res) {
      const rows = await db('keyholders as k')
        .join('sites as s', 's.id', 'k.site_id')
        .leftJoin('organisations as mc', 'mc.id', 's.monitoring_centre_id')
        .where('k.user_id', currentUser(req).id)
        .orderBy('s.name')
        .select(
          'k.id as keyholder_id',
          'k.call_order',
          'k.minutes_to_attend',
          's.id as site_id',
          's.name',
          's.address_line1',
          's.address_line2',
          's.town',
          's.postcode',
          's.access_notes',
          's.hazards',
          ...contact('mc'),
          db.raw(
            '(select count(*)::int from keyholders other where other.site_id = s.id) as keyholder_count',
          ),
        );
      const keyholdings: Keyholding[] = rows.map((row: Row) => ({
        siteId: row.site_id as string,
        keyholderId: row.keyholder_id as string,
        siteName: row.name as string,
        address: address(row),
        accessNotes: row.access_notes as string,
        hazards: row.hazards as string,
        callOrder: row.call_order as number,
        keyholderCount: row.keyholder_count as number,
        minutesToAttend: row.minutes_to_attend as number,
        monitoringCentre: toContact(row, 'mc'),
      }));
      res.json({ keyholdings });
    },
  );

  return router;
}
