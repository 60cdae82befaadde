import type { ChangeRequest } from '@server/change-requests/schema';
import { CircleCheck, CircleDot, MessageSquareText, RotateCcw } from 'lucide-react';
import { useId, useState } from 'react';

import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { LiveMessage } from '@/components/ui/live-message';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useChangeRequests } from '@/features/change-requests/api/get-change-requests';
import { useUpdateChangeRequest } from '@/features/change-requests/api/update-change-request';
import { cn } from '@/utils/cn';
import { formatDateTime } from '@/utils/format';

type Status = ChangeRequest['status'];

const statusWords: Record<Status, string> = { open: 'Open', closed: 'Closed' };

function StatusBadge({ status }: { status: Status }) {
  const Icon = status === 'open' ? CircleDot : CircleCheck;
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 font-semibold',
        status === 'open' ? 'text-info' : 'text-normal',
      )}
    >
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      {statusWords[status]}
    </span>
  );
}

type ChangeRequestItemProps = {
  siteId: string;
  request: ChangeRequest;
  canManage: boolean;
  announce: (message: string) => void;
};

function ChangeRequestItem({ siteId, request, canManage, announce }: ChangeRequestItemProps) {
  const updateRequest = useUpdateChangeRequest({
    mutationConfig: {
      onSuccess: (saved) =>
        announce(
          saved.status === 'closed'
            ? `“${saved.subject}” closed.`
            : `“${saved.subject}” opened again.`,
        ),
    },
  });
  const nextStatus: Status = request.status === 'open' ? 'closed' : 'open';

  return (
    <li className="grid gap-2 px-4 py-4 md:px-5">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h3 className="font-semibold break-words">{request.subject}</h3>
        <StatusBadge status={request.status} />
      </div>
      <p className="break-words whitespace-pre-wrap">{request.details}</p>
      <p className="text-sm text-ink-muted">
        Asked by {request.requestedBy ?? 'a former homeowner'},{' '}
        <time dateTime={request.createdAt}>{formatDateTime(request.createdAt)}</time>
      </p>
      {updateRequest.isError ? <ProblemAlert error={updateRequest.error} /> : null}
      {canManage ? (
        <div>
          <Button
            variant="secondary"
            disabled={updateRequest.isPending}
            onClick={() =>
              updateRequest.mutate({
                siteId,
                requestId: request.id,
                data: { status: nextStatus },
              })
            }
          >
            {nextStatus === 'closed' ? (
              <CircleCheck aria-hidden="true" className="size-4" />
            ) : (
              <RotateCcw aria-hidden="true" className="size-4" />
            )}
            {nextStatus === 'closed' ? 'Mark as dealt with' : 'Open again'}
            <span className="sr-only">: {request.subject}</span>
          </Button>
        </div>
      ) : null}
    </li>
  );
}

type ChangeRequestListProps = {
  siteId: string;
  /** Installer staff filter by status and close requests; homeowners see all with their status. */
  viewer: 'staff' | 'homeowner';
};

export function ChangeRequestList({ siteId, viewer }: ChangeRequestListProps) {
  const { data: requests } = useChangeRequests(siteId);
  const [shownStatus, setShownStatus] = useState<Status>('open');
  const [message, setMessage] = useState('');
  const filterName = useId();
  const isStaff = viewer === 'staff';
  const counts: Record<Status, number> = {
    open: requests.filter((request) => request.status === 'open').length,
    closed: requests.filter((request) => request.status === 'closed').length,
  };
  const shown = isStaff ? requests.filter((request) => request.status === shownStatus) : requests;
  const title = isStaff ? 'Change requests from the homeowner' : 'Your earlier requests';

  return (
    <Card title={title} icon={MessageSquareText} flush>
      {isStaff ? (
        <fieldset className="flex flex-wrap items-center gap-2 border-b border-hairline px-4 py-3 md:px-5">
          <legend className="sr-only">Show requests that are</legend>
          {(['open', 'closed'] as const).map((status) => (
            <label
              key={status}
              className={cn(
                'inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-md border px-4 font-semibold',
                'has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-ink',
                shownStatus === status
                  ? 'border-ink bg-ink text-paper'
                  : 'border-ink/35 bg-white text-ink hover:bg-paper-deep',
              )}
            >
              <input
                type="radio"
                name={filterName}
                value={status}
                checked={shownStatus === status}
                onChange={() => setShownStatus(status)}
                className="sr-only"
              />
              {statusWords[status]}
              <span className="font-mono">({counts[status]})</span>
            </label>
          ))}
        </fieldset>
      ) : null}
      {shown.length > 0 ? (
        <ul aria-label={title} className="divide-y divide-hairline">
          {shown.map((request) => (
            <ChangeRequestItem
              key={request.id}
              siteId={siteId}
              request={request}
              canManage={isStaff}
              announce={setMessage}
            />
          ))}
        </ul>
      ) : (
        <p className="px-4 py-4 text-ink-muted md:px-5">
          {isStaff ? `No ${shownStatus} requests.` : 'You have not asked for any changes yet.'}
        </p>
      )}
      <LiveMessage message={message} />
    </Card>
  );
}
