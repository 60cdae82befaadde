import { z } from 'zod';
import {
  environmentalClassSchema,
  gradeSchema,
  idSchema,
  notes,
  postcodeSchema,
  required,
  trimmed,
  versionSchema,
  withoutDefaults,
} from '../schema/fields';

export const URN_STATUSES = ['none', 'applied', 'active', 'warning', 'withdrawn'] as const;
export const urnStatusSchema = z.enum(URN_STATUSES);
export type UrnStatus = z.infer<typeof urnStatusSchema>;

export const PREMISES_TYPES = ['domestic', 'commercial'] as const;

/** SIA DC-09 account numbers are 3 to 16 hexadecimal characters (from memory of DC-09). */
export const monitoringAccountSchema = z
  .string()
  .trim()
  .regex(/^[0-9A-Fa-f]{3,16}$/, 'Use 3 to 16 characters, each 0–9 or A–F.')
  .transform((value) => value.toUpperCase());

const siteFields = {
  name: required(120, 'Site name'),
  premisesType: z.enum(PREMISES_TYPES, { error: 'Choose domestic or commercial.' }),
  addressLine1: required(200, 'Address'),
  addressLine2: trimmed(200, 'Address line 2').default(''),
  town: required(100, 'Town'),
  postcode: postcodeSchema,
  accessNotes: notes().default(''),
  hazards: notes().default(''),
  riskNotes: notes().default(''),
  requiredGrade: gradeSchema,
  gradeRationale: notes().default(''),
  environmentalClass: environmentalClassSchema,
  policeUrn: trimmed(40, 'URN').nullable().default(null),
  urnStatus: urnStatusSchema.default('none'),
  monitoringCentreId: idSchema.nullable().default(null),
  monitoringAccount: monitoringAccountSchema.nullable().default(null),
};

type SiteFieldValues = {
  policeUrn?: string | null;
  urnStatus?: UrnStatus;
  monitoringCentreId?: string | null;
  monitoringAccount?: string | null;
};

/** Rules across fields; applied to whole records, and after any partial edit is merged. */
export function siteConsistencyProblems(
  site: SiteFieldValues,
): { path: string[]; message: string }[] {
  const problems: { path: string[]; message: string }[] = [];
  if (Boolean(site.monitoringCentreId) !== Boolean(site.monitoringAccount)) {
    problems.push({
      path: [site.monitoringCentreId ? 'monitoringAccount' : 'monitoringCentreId'],
      message: 'A monitored site needs both its monitoring centre and its account number.',
    });
  }
  const policed =
    site.urnStatus === 'active' || site.urnStatus === 'warning' || site.urnStatus === 'withdrawn';
  if (policed && !site.policeUrn) {
    problems.push({
      path: ['policeUrn'],
      message: 'Police response needs the URN the police issued.',
    });
  }
  return problems;
}

export const createSiteSchema = z
  .object({ ...siteFields, installerId: idSchema.optional() })
  .strict()
  .superRefine((site, context) => {
    for (const problem of siteConsistencyProblems(site))
      context.addIssue({ code: 'custom', ...problem });
  });
export type CreateSiteInput = z.input<typeof createSiteSchema>;

export const updateSiteSchema = z
  .object({ ...withoutDefaults(siteFields), version: versionSchema })
  .partial()
  .required({ version: true })
  .strict();
export type UpdateSiteInput = z.input<typeof updateSiteSchema>;

export const SITE_SORTS = [
  'reference',
  'name',
  'town',
  'postcode',
  'requiredGrade',
  'updatedAt',
] as const;

export const siteListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(5).max(100).default(25),
  sort: z.enum(SITE_SORTS).default('reference'),
  order: z.enum(['asc', 'desc']).default('asc'),
  q: z.string().trim().max(100).optional(),
  grade: z.coerce.number().pipe(gradeSchema).optional(),
  urnStatus: urnStatusSchema.optional(),
  monitored: z.enum(['yes', 'no']).optional(),
  engineerId: idSchema.optional(),
});
export type SiteListQuery = z.input<typeof siteListQuerySchema>;

export const assignEngineersSchema = z.object({ userIds: z.array(idSchema).max(50) }).strict();

export const inviteHomeownerSchema = z
  .object({
    displayName: required(120, 'Name'),
    email: z
      .string()
      .trim()
      .toLowerCase()
      .pipe(z.email('Enter an e-mail address such as name@example.com.')),
  })
  .strict();

// --- Responses ---------------------------------------------------------------------------------

const personRef = z.object({ id: z.string(), displayName: z.string() });
const organisationRef = z.object({ id: z.string(), name: z.string() });

export const siteListItemSchema = z.object({
  id: z.string(),
  reference: z.string(),
  name: z.string(),
  town: z.string(),
  postcode: z.string(),
  premisesType: z.enum(PREMISES_TYPES),
  requiredGrade: z.number(),
  urnStatus: urnStatusSchema,
  monitoringCentre: organisationRef.nullable(),
  zoneCount: z.number(),
  engineers: z.array(personRef),
  updatedAt: z.string(),
});
export type SiteListItem = z.infer<typeof siteListItemSchema>;

export const siteListSchema = z.object({
  items: z.array(siteListItemSchema),
  page: z.number(),
  pageSize: z.number(),
  total: z.number(),
});
export type SiteList = z.infer<typeof siteListSchema>;

export const siteDetailSchema = z.object({
  id: z.string(),
  reference: z.string(),
  name: z.string(),
  premisesType: z.enum(PREMISES_TYPES),
  addressLine1: z.string(),
  addressLine2: z.string(),
  town: z.string(),
  postcode: z.string(),
  accessNotes: z.string(),
  hazards: z.string(),
  riskNotes: z.string(),
  requiredGrade: z.number(),
  gradeRationale: z.string(),
  environmentalClass: z.number(),
  policeUrn: z.string().nullable(),
  urnStatus: urnStatusSchema,
  monitoringCentre: organisationRef.nullable(),
  monitoringAccount: z.string().nullable(),
  installer: organisationRef,
  engineers: z.array(personRef),
  homeowners: z.array(personRef.extend({ email: z.string() })),
  counts: z.object({
    zones: z.number(),
    devices: z.number(),
    keyholders: z.number(),
    userSlots: z.number(),
    files: z.number(),
  }),
  version: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type SiteDetail = z.infer<typeof siteDetailSchema>;
