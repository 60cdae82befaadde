import {
  CircleCheck,
  CircleX,
  Clock,
  MessageSquareText,
  Send,
  TriangleAlert,
  type LucideIcon,
} from 'lucide-react';

import { Button } from '@/components/ui/button';
import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import type {
  AlarmEventDetail,
  CallOut,
  KeyholderMessage,
} from '@/features/monitoring/api/get-alarm-event';
import { useStartCallOut } from '@/features/monitoring/api/start-call-out';
import { ActionProblem } from '@/features/monitoring/components/action-problem';
import { formatPhoneForReading } from '@/lib/phone';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { cn } from '@/utils/cn';

const MESSAGE_STATES: Record<
  KeyholderMessage['status'],
  { label: string; icon: LucideIcon; className: string }
> = {
  queued: { label: 'Waiting to send', icon: Clock, className: 'text-info' },
  sending: { label: 'Sending', icon: Send, className: 'text-info' },
  sent: { label: 'Sent', icon: Send, className: 'text-info' },
  delivered: { label: 'Delivered', icon: CircleCheck, className: 'text-normal' },
  failed: { label: 'Could not send', icon: TriangleAlert, className: 'text-alarm' },
  undelivered: { label: 'Not delivered', icon: TriangleAlert, className: 'text-alarm' },
};

function StatusWithIcon({
  label,
  icon: Icon,
  className,
}: {
  label: string;
  icon: LucideIcon;
  className: string;
}) {
  return (
    <span className="inline-flex items-center gap-1.5 font-medium whitespace-nowrap">
      <Icon aria-hidden="true" className={cn('size-4 shrink-0', className)} />
      {label}
    </span>
  );
}

const time = (iso: string | null) =>
  iso ? (
    <time dateTime={iso}>
      {new Date(iso).toLocaleTimeString('en-GB', {
        hour: '2-digit',
        minute: '2-digit',
        second: '2-digit',
      })}
    </time>
  ) : (
    '–'
  );

const columns: DataTableColumn<KeyholderMessage>[] = [
  { header: 'No.', className: 'font-mono', cell: (message) => message.position },
  {
    header: 'Keyholder',
    isRowHeader: true,
    cell: (message) => (
      <>
        <span className="block">{message.name}</span>
        <span className="block font-mono text-xs text-ink-muted">
          {formatPhoneForReading(message.phone)}
        </span>
      </>
    ),
  },
  {
    header: 'Text',
    cell: (message) => <StatusWithIcon {...MESSAGE_STATES[message.status]} />,
  },
  {
    header: 'Reply',
    cell: (message) =>
      message.reply === 'attending' ? (
        <StatusWithIcon label="Attending" icon={CircleCheck} className="text-normal" />
      ) : message.reply === 'cannot_attend' ? (
        <StatusWithIcon label="Cannot attend" icon={CircleX} className="text-alarm" />
      ) : (
        <span className="text-ink-muted">No reply yet</span>
      ),
  },
  { header: 'Sent', className: 'font-mono whitespace-nowrap', cell: (m) => time(m.sentAt) },
  {
    header: 'Delivered',
    className: 'font-mono whitespace-nowrap',
    cell: (m) => time(m.deliveredAt),
  },
  { header: 'Replied', className: 'font-mono whitespace-nowrap', cell: (m) => time(m.repliedAt) },
];

function describeCallOut(callOut: CallOut): string {
  const attending =
    callOut.attending ?? callOut.messages.find((message) => message.reply === 'attending')?.name;
  const wait = callOut.waitMinutes;
  switch (callOut.status) {
    case 'not_started':
      return 'No keyholder has been texted about this event.';
    case 'calling':
      return `Texting keyholders in call order. The next is texted when ${wait} ${wait === 1 ? 'minute passes' : 'minutes pass'} without anyone saying they will attend.`;
    case 'accepted':
      return attending
        ? `${attending} is attending. Remind them of the cautions below if you speak to them.`
        : 'A keyholder is attending.';
    case 'exhausted':
      return "Every keyholder in the call plan has been texted and none is attending. Phone them, or follow your centre's procedure.";
    case 'stood_down':
      return 'The call-out was stood down.';
  }
}

const STATUS_ID = 'call-out-status';

type CallOutPanelProps = {
  detail: AlarmEventDetail;
  /** Only the operator who has taken the event may start the call-out. */
  canAct: boolean;
};

/** Texting keyholders in call order, with each text's delivery and reply as they happen. */
export function CallOutPanel({ detail, canAct }: CallOutPanelProps) {
  const focusAfterRender = useFocusAfterRender();
  // The button goes once the call-out starts: focus moves to what it is doing instead.
  const startCallOut = useStartCallOut({
    mutationConfig: { onSuccess: () => focusAfterRender(STATUS_ID) },
  });
  const { callOut } = detail;
  const canStart = canAct && callOut.status === 'not_started' && detail.callPlan.length > 0;

  return (
    <section
      aria-labelledby="call-out-heading"
      className="overflow-hidden rounded-lg border border-hairline bg-white"
    >
      <div className="flex items-center gap-2 border-b border-hairline px-4 py-3 md:px-5">
        <MessageSquareText aria-hidden="true" className="size-5 shrink-0" />
        <h2 id="call-out-heading" tabIndex={-1} className="text-base font-semibold">
          Keyholder call-out
        </h2>
      </div>
      <div className="grid gap-3 px-4 py-4 md:px-5">
        <p id={STATUS_ID} tabIndex={-1} aria-live="polite" className="text-sm">
          {describeCallOut(callOut)}
        </p>
        {canStart ? (
          <div className="flex flex-wrap items-center gap-3">
            <Button
              disabled={startCallOut.isPending}
              onClick={() => startCallOut.mutate(detail.event.id)}
            >
              <Send aria-hidden="true" className="size-4" />
              {startCallOut.isPending ? 'Starting…' : 'Text keyholders in call order'}
            </Button>
            <p className="text-sm text-ink-muted">
              Texts carry no address and no codes; keyholders reply 1 (attending) or 2 (cannot).
            </p>
          </div>
        ) : null}
        {canAct && detail.callPlan.length === 0 ? (
          <p className="text-sm">This site has no keyholders to text. Record any calls below.</p>
        ) : null}
        {startCallOut.error ? (
          <ActionProblem title="The call-out did not start." error={startCallOut.error} />
        ) : null}
      </div>
      {callOut.messages.length > 0 ? (
        <DataTable
          caption="Texts to keyholders"
          columns={columns}
          rows={callOut.messages}
          rowKey={(message) => message.id}
          emptyMessage="No texts yet."
          dense
        />
      ) : null}
    </section>
  );
}
