import { CloudOff, RefreshCw, Smartphone, Trash2, TriangleAlert } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { LiveMessage } from '@/components/ui/live-message';
import type { OutboxState } from '@/features/commissioning/utils/use-outbox';
import { useOnline } from '@/lib/use-online';
import { formatDateTime } from '@/utils/format';

const PROBLEMS: Record<NonNullable<OutboxState['lastProblem']>, string> = {
  offline: 'No connection at the moment; they go as soon as there is one.',
  'signed-out': 'Your session has ended: sign in again (in another tab) and they will go.',
  server: 'Wardbook is not answering at the moment; they will be tried again shortly.',
};

/**
 * What is waiting on this phone to be sent, with a button to try now. Records the API refused
 * on resending stay listed with the reason, to be put right and saved again, then discarded.
 */
export function OutboxNotice({ outbox }: { outbox: OutboxState }) {
  const online = useOnline();
  const { entries, waiting } = outbox;
  const refused = entries.filter((entry) => entry.refusal);
  return (
    <>
      {!online ? (
        <p className="flex items-start gap-2 rounded-md border border-l-4 border-hairline border-l-info bg-white p-3 text-sm">
          <CloudOff aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-info" />
          <span>
            <span className="font-semibold">No connection.</span> Tests you save are kept on this
            phone and sent when the connection is back.
          </span>
        </p>
      ) : null}
      {entries.length > 0 ? (
        <section
          aria-labelledby="outbox-heading"
          className="grid gap-3 rounded-lg border border-l-4 border-hairline border-l-info bg-white p-3 md:p-4"
        >
          <h2 id="outbox-heading" className="flex items-center gap-2 font-semibold">
            <Smartphone aria-hidden="true" className="size-5 shrink-0 text-info" />
            {waiting.length === 1
              ? '1 record waiting on this phone'
              : `${waiting.length} records waiting on this phone`}
          </h2>
          {waiting.length > 0 ? (
            <p className="text-sm">
              {outbox.lastProblem ? PROBLEMS[outbox.lastProblem] : 'They will be sent shortly.'}
              {outbox.storageRefused
                ? ' This browser would not store them, so keep this page open until they have gone.'
                : ''}
            </p>
          ) : null}
          <ul className="grid gap-2 text-sm">
            {entries.map((entry) => (
              <li key={entry.clientKey} className="grid gap-1">
                <span>
                  <span className="font-medium">{entry.label}</span>, done{' '}
                  {formatDateTime(entry.queuedAt)}
                </span>
                {entry.refusal ? (
                  <span className="flex flex-wrap items-center gap-2">
                    <span className="inline-flex items-start gap-1.5 font-medium text-alarm">
                      <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
                      Not accepted: {entry.refusal}
                    </span>
                    <Button
                      variant="secondary"
                      size="lg"
                      onClick={() => outbox.discard(entry.clientKey)}
                      aria-label={`Discard: ${entry.label}`}
                    >
                      <Trash2 aria-hidden="true" className="size-4" />
                      Discard
                    </Button>
                  </span>
                ) : null}
              </li>
            ))}
          </ul>
          {waiting.length > 0 ? (
            <div>
              <Button
                variant="secondary"
                size="lg"
                onClick={outbox.sendNow}
                disabled={outbox.isSending}
              >
                <RefreshCw aria-hidden="true" className="size-5" />
                {outbox.isSending ? 'Sending…' : 'Send now'}
              </Button>
            </div>
          ) : null}
          {refused.length > 0 ? (
            <p className="text-sm text-ink-muted">
              A record that was not accepted will not be sent again: save it afresh with the fault
              put right, then discard it here.
            </p>
          ) : null}
        </section>
      ) : null}
      <LiveMessage message={outbox.announcement} />
    </>
  );
}
