/**
 * Wardbook's invented demo scenario. Every company, person and address here is made up;
 * e-mail addresses are at example.com (phone numbers, when added, from Ofcom's drama range).
 * The passwords and one-time-password secrets are for local demonstration only.
 */
export const DEMO_PASSWORD = 'wardbook-demo-2026';

export const DEMO_INSTALLER = {
  name: 'Fernmoor Alarm Services Ltd',
  kind: 'installer',
  /** Pack numbers read FAS-000001-R1, FAS-000002-R1, … */
  pack_prefix: 'FAS',
} as const;

export const DEMO_MONITORING_CENTRE = {
  name: 'Halden Watch Monitoring',
  kind: 'monitoring_centre',
} as const;

export interface DemoAccount {
  role: 'engineer' | 'office' | 'homeowner' | 'keyholder' | 'operator';
  displayName: string;
  email: string;
  organisation: 'installer' | 'monitoring_centre' | null;
  /** Base32 TOTP secret, pre-enrolled so the demo can sign in; null where none is required. */
  totpSecret: string | null;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  {
    role: 'engineer',
    displayName: 'Callum Reyes',
    email: 'callum.reyes@example.com',
    organisation: 'installer',
    totpSecret: 'TJN2HMISFDEAU7FVFUQKTXC6EQCLJFWY',
  },
  {
    role: 'office',
    displayName: 'Bridget Okafor',
    email: 'bridget.okafor@example.com',
    organisation: 'installer',
    totpSecret: 'FTH6P73UC23JEZBX26NJ7MKEFXPCLT6D',
  },
  {
    role: 'homeowner',
    displayName: 'Helen Marsh',
    email: 'helen.marsh@example.com',
    organisation: null,
    totpSecret: null,
  },
  {
    role: 'keyholder',
    displayName: 'Sam Whitlock',
    email: 'sam.whitlock@example.com',
    organisation: null,
    totpSecret: null,
  },
  {
    role: 'operator',
    displayName: 'Priya Nandakumar',
    email: 'priya.nandakumar@example.com',
    organisation: 'monitoring_centre',
    totpSecret: '7ZA7TVU4AXAH22O6NDKCUDU7VN46FG5V',
  },
];
