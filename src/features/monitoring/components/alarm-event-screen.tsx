import { ChevronLeft } from 'lucide-react';
import { Link } from 'react-router-dom';

import { PageHeading } from '@/components/ui/page-heading';
import { paths } from '@/config/paths';
import { useAlarmEvent } from '@/features/monitoring/api/get-alarm-event';
import { useMonitoringStream } from '@/features/monitoring/api/use-monitoring-stream';
import { CallOutPanel } from '@/features/monitoring/components/call-out-panel';
import { CloseEventForm } from '@/features/monitoring/components/close-event-form';
import { ConfirmedBadge } from '@/features/monitoring/components/confirmed-badge';
import { EventTimeline } from '@/features/monitoring/components/event-timeline';
import { KeyholderDispatchCautions } from '@/features/monitoring/components/keyholder-dispatch-cautions';
import { LiveIndicator } from '@/features/monitoring/components/live-indicator';
import { PoliceRequestPanel } from '@/features/monitoring/components/police-request-panel';
import { PriorityMarker } from '@/features/monitoring/components/priority-marker';
import { RecordCallForm } from '@/features/monitoring/components/record-call-form';
import { SitePanel } from '@/features/monitoring/components/site-panel';
import { TakeEventPanel } from '@/features/monitoring/components/take-event-panel';
import { TickingAge } from '@/features/monitoring/components/ticking-age';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { categoryLabel } from '@/utils/alarm-words';
import { formatDateTime } from '@/utils/format';

type AlarmEventScreenProps = { eventId: string; myUserId: string };

/** One event: who has it, what to do, the site beside it and the timeline, all kept live. */
export function AlarmEventScreen({ eventId, myUserId }: AlarmEventScreenProps) {
  const streamState = useMonitoringStream();
  const { data: detail } = useAlarmEvent(eventId);
  const focusAfterRender = useFocusAfterRender();
  const { event } = detail;
  const siteName = event.siteName ?? `unknown account ${event.account}`;
  const isMine = event.status === 'taken' && event.takenById === myUserId;

  return (
    <>
      <title>{`${categoryLabel(event.category)} at ${siteName} · Wardbook`}</title>
      <Link
        to={paths.home.operator.getHref()}
        className="-ml-1 mb-3 inline-flex min-h-10 items-center gap-1 px-1 text-sm font-medium"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        Signal queue
      </Link>
      <PageHeading title={`${categoryLabel(event.category)} at ${siteName}`}>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm text-ink">
          <PriorityMarker priority={event.priority} />
          {event.confirmed ? <ConfirmedBadge /> : null}
          <span>
            Zones{' '}
            <span className="font-mono font-semibold">
              {event.zones.length > 0 ? event.zones.join(', ') : 'none given'}
            </span>
          </span>
          <span>
            First signal{' '}
            <time dateTime={event.firstSignalAt}>{formatDateTime(event.firstSignalAt)}</time>
            {event.status !== 'closed' ? (
              <>
                {' '}
                (<TickingAge since={event.firstSignalAt} /> ago)
              </>
            ) : null}
          </span>
          {event.restoredAt ? <span>Restored since</span> : null}
          <LiveIndicator state={streamState} />
        </div>
      </PageHeading>

      <div className="grid gap-6">
        <TakeEventPanel
          detail={detail}
          myUserId={myUserId}
          onTaken={() => focusAfterRender('call-out-heading')}
        />
        <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
          <div className="grid min-w-0 content-start gap-6">
            {event.status === 'open' ? (
              <p className="text-sm text-ink-muted">
                Take the event to text keyholders, record calls, ask for the police or close it.
              </p>
            ) : null}
            <CallOutPanel detail={detail} canAct={isMine} />
            {event.status !== 'closed' ? <KeyholderDispatchCautions /> : null}
            {isMine ? <RecordCallForm detail={detail} /> : null}
            {event.status !== 'closed' || detail.police.requestedAt ? (
              <PoliceRequestPanel detail={detail} canAct={isMine} />
            ) : null}
            {isMine ? (
              <CloseEventForm
                detail={detail}
                onClosed={() => focusAfterRender('handling-heading')}
              />
            ) : null}
            <EventTimeline timeline={detail.timeline} />
          </div>
          <aside aria-label="The site" className="grid min-w-0 content-start gap-6">
            <SitePanel detail={detail} />
          </aside>
        </div>
      </div>
    </>
  );
}
