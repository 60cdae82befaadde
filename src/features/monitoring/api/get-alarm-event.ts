import { alarmEventSchema } from '@server/monitoring/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { monitoringQueryKeys } from '@/features/monitoring/api/monitoring-query-keys';
import { api } from '@/lib/api-client';

const falseAlarmsSchema = z.object({
  count: z.number(),
  standing: z.enum(['in_good_standing', 'warning', 'withdrawal_due']),
  oldestDropsOffAt: z.string().nullable(),
});

export const keyholderMessageSchema = z.object({
  id: z.string(),
  position: z.number(),
  name: z.string(),
  phone: z.string(),
  status: z.enum(['queued', 'sending', 'sent', 'delivered', 'failed', 'undelivered']),
  reply: z.enum(['attending', 'cannot_attend']).nullable(),
  queuedAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  deliveredAt: z.string().nullable(),
  repliedAt: z.string().nullable(),
});
export type KeyholderMessage = z.infer<typeof keyholderMessageSchema>;

const callOutSchema = z.object({
  status: z.enum(['not_started', 'calling', 'accepted', 'exhausted', 'stood_down']),
  waitMinutes: z.number(),
  /** Who accepted, by text, in the app or on a recorded call. */
  attending: z.string().nullable(),
  messages: z.array(keyholderMessageSchema),
});
export type CallOut = z.infer<typeof callOutSchema>;

const policeSchema = z.object({
  eligible: z.boolean(),
  reason: z.string(),
  urn: z.string().nullable(),
  requestedAt: z.string().nullable(),
  incidentReference: z.string().nullable(),
});
export type PoliceRequest = z.infer<typeof policeSchema>;

const alarmEventDetailSchema = z.object({
  event: alarmEventSchema,
  falseAlarms: falseAlarmsSchema.nullable(),
  site: z
    .object({
      name: z.string(),
      reference: z.string(),
      address: z.array(z.string()),
      hazards: z.string(),
      accessNotes: z.string(),
      policeUrn: z.string().nullable(),
      urnStatus: z.string(),
      confirmationWindowMinutes: z.number().nullable(),
    })
    .nullable(),
  callPlan: z.array(
    z.object({
      position: z.number(),
      name: z.string(),
      phone: z.string(),
      minutesToAttend: z.number(),
    }),
  ),
  recentEvents: z.array(
    z.object({
      id: z.string(),
      category: z.string(),
      at: z.string(),
      outcome: z.string().nullable(),
    }),
  ),
  timeline: z.array(
    z.object({ at: z.string(), kind: z.string(), text: z.string(), actor: z.string().nullable() }),
  ),
  callOut: callOutSchema,
  police: policeSchema,
  handling: z.object({
    secondsToTake: z.number().nullable(),
    secondsToClose: z.number().nullable(),
  }),
});
export { alarmEventDetailSchema };
export type AlarmEventDetail = z.infer<typeof alarmEventDetailSchema>;

export function alarmEventUrl(eventId: string) {
  return `/api/monitoring/events/${encodeURIComponent(eventId)}`;
}

/** One event with the site panel, call plan, call-out, police request and timeline. */
export function getAlarmEvent(eventId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(alarmEventUrl(eventId), alarmEventDetailSchema, { signal });
}

export const getAlarmEventQueryOptions = (eventId: string) =>
  queryOptions({
    queryKey: monitoringQueryKeys.detail(eventId),
    queryFn: ({ signal }) => getAlarmEvent(eventId, { signal }),
    refetchInterval: 60_000,
    staleTime: 5_000,
  });

export const useAlarmEvent = (eventId: string) =>
  useSuspenseQuery(getAlarmEventQueryOptions(eventId));
