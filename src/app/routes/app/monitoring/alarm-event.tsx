import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs, type Params } from 'react-router-dom';

import { useMe } from '@/features/auth/api/get-me';
import { getAlarmEventQueryOptions } from '@/features/monitoring/api/get-alarm-event';
import { AlarmEventScreen } from '@/features/monitoring/components/alarm-event-screen';

function eventIdFrom(params: Params): string {
  const eventId = params.eventId;
  if (!eventId)
    throw new Response('No event in the address', { status: 404, statusText: 'Not Found' });
  return eventId;
}

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getAlarmEventQueryOptions(eventIdFrom(params)));
    return null;
  };
}

export function Component() {
  const eventId = eventIdFrom(useParams());
  const { data: me } = useMe();
  return <AlarmEventScreen eventId={eventId} myUserId={me?.user.id ?? ''} />;
}
