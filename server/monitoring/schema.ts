import { z } from 'zod';
import { trimmed } from '../schema/fields';

/** How an event ended. False alarms count against the site's police response (NPCC policy). */
export const OUTCOMES = [
  'genuine',
  'false_alarm_user',
  'false_alarm_equipment',
  'false_alarm_environment',
  'false_alarm_unknown',
  'test_or_engineer',
  'no_action_needed',
] as const;
export type Outcome = (typeof OUTCOMES)[number];

export const OUTCOME_LABELS: Record<Outcome, string> = {
  genuine: 'Genuine: intruder, hold-up or fire',
  false_alarm_user: 'False alarm: user error',
  false_alarm_equipment: 'False alarm: equipment fault',
  false_alarm_environment: 'False alarm: environment (draughts, pests, heat)',
  false_alarm_unknown: 'False alarm: cause not found',
  test_or_engineer: 'Test or engineer on site',
  no_action_needed: 'No action needed (fault or tamper logged)',
};

export const closeEventInputSchema = z
  .object({
    outcome: z.enum(OUTCOMES, { error: 'Choose how the event ended.' }),
    note: trimmed(1000, 'Note').default(''),
  })
  .strict();

export const eventListQuerySchema = z.object({
  status: z.enum(['active', 'closed']).default('active'),
});

export const alarmEventSchema = z.object({
  id: z.string(),
  siteId: z.string().nullable(),
  siteName: z.string().nullable(),
  siteReference: z.string().nullable(),
  account: z.string(),
  category: z.string(),
  priority: z.number(),
  status: z.enum(['open', 'taken', 'closed']),
  confirmed: z.boolean(),
  zones: z.array(z.number()),
  firstSignalAt: z.string(),
  lastSignalAt: z.string(),
  restoredAt: z.string().nullable(),
  takenBy: z.string().nullable(),
  /** Who has it, so a screen can tell the operator's own events from a namesake's. */
  takenById: z.string().nullable(),
  closedAt: z.string().nullable(),
  outcome: z.string().nullable(),
});
export type AlarmEvent = z.infer<typeof alarmEventSchema>;
