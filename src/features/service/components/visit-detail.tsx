import type { ServiceVisit } from '@server/service/schema';
import { X } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';

import { buttonClassName } from '@/components/ui/button-styles';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { DetailItem } from '@/components/ui/detail-item';
import { EngineerSafetyCard } from '@/components/ui/engineer-safety-card';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { paths, type SiteRole } from '@/config/paths';
import { formatCalendarDate } from '@/lib/dates';
import { useUpdateVisit } from '@/features/service/api/update-visit';
import { MoveVisitForm, type EngineerChoice } from '@/features/service/components/move-visit-form';
import { VisitStatusWords } from '@/features/service/components/visit-status-words';
import {
  describeBooking,
  inlineLinkClassName,
  kindLabel,
  visitDay,
} from '@/features/service/utils/visit-words';

type VisitDetailProps = {
  visit: ServiceVisit;
  role: SiteRole;
  engineers: readonly EngineerChoice[];
  today: string;
  closeHref: string;
  /** Focus the heading when the panel opens for this visit by someone's choice. */
  takeFocus: boolean;
  reloadVisit: () => Promise<ServiceVisit | undefined>;
  onChanged: (visit: ServiceVisit) => void;
};

/**
 * One visit: where, what, when and who. This is where an engineer is sent to site, so the site
 * work cautions sit beside it; the office also assigns, moves or cancels it here.
 */
export function VisitDetail({
  visit,
  role,
  engineers,
  today,
  closeHref,
  takeFocus,
  reloadVisit,
  onChanged,
}: VisitDetailProps) {
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    if (takeFocus) headingRef.current?.focus();
  }, [takeFocus, visit.id]);

  return (
    <div className="grid gap-6">
      <section
        aria-labelledby="visit-detail-heading"
        className="rounded-lg border border-hairline bg-white"
      >
        <div className="flex items-start justify-between gap-3 border-b border-hairline px-4 py-3 md:px-5">
          <div>
            <p className="text-sm text-ink-muted">{kindLabel(visit)}</p>
            <h2
              id="visit-detail-heading"
              ref={headingRef}
              tabIndex={-1}
              className="text-lg font-semibold focus:outline-none"
            >
              <span className="font-mono">{visit.siteReference}</span> {visit.siteName}
            </h2>
          </div>
          <Link
            to={closeHref}
            className={buttonClassName({ variant: 'secondary', className: 'shrink-0' })}
          >
            <X aria-hidden="true" className="size-4" />
            Close<span className="sr-only"> the visit details</span>
          </Link>
        </div>
        <div className="grid gap-5 px-4 py-4 md:px-5">
          <dl className="grid gap-3 sm:grid-cols-2">
            <DetailItem term="Status">
              <VisitStatusWords visit={visit} today={today} />
            </DetailItem>
            <DetailItem term="Town">{visit.siteTown}</DetailItem>
            <DetailItem term="Booked for">{describeBooking(visit.scheduledFor)}</DetailItem>
            <DetailItem term="Due">{formatCalendarDate(visit.dueDate)}</DetailItem>
            <DetailItem term="Engineer">{visit.engineer?.name ?? 'No engineer yet'}</DetailItem>
            {visit.planVisitsPerYear ? (
              <DetailItem term="Plan when booked">
                {visit.planVisitsPerYear === 1
                  ? '1 preventive visit a year'
                  : `${visit.planVisitsPerYear} preventive visits a year`}
              </DetailItem>
            ) : null}
            {visit.reportedFault ? (
              <div className="sm:col-span-2">
                <DetailItem term="Reported fault">
                  <span className="whitespace-pre-line">{visit.reportedFault}</span>
                </DetailItem>
              </div>
            ) : null}
          </dl>
          <p className="text-sm">
            <Link
              to={paths.sites.workspace.getHref(role, visit.siteId)}
              className={inlineLinkClassName}
            >
              Open the site record
            </Link>{' '}
            for its address, access notes and hazards.
          </p>
          {role === 'engineer' && visit.status === 'scheduled' ? (
            <p>
              <Link
                to={paths.completeVisit.getHref(visit.id, visitDay(visit))}
                className={buttonClassName({ variant: 'primary', size: 'lg' })}
              >
                Complete this visit
              </Link>
            </p>
          ) : null}
          {role === 'office' ? (
            <OfficeActions
              visit={visit}
              engineers={engineers}
              reloadVisit={reloadVisit}
              onChanged={onChanged}
            />
          ) : null}
        </div>
      </section>
      <EngineerSafetyCard />
    </div>
  );
}

type OfficeActionsProps = Pick<
  VisitDetailProps,
  'visit' | 'engineers' | 'reloadVisit' | 'onChanged'
>;

function OfficeActions({ visit, engineers, reloadVisit, onChanged }: OfficeActionsProps) {
  const [statusMessage, setStatusMessage] = useState('');
  const changeStatus = useUpdateVisit({
    mutationConfig: {
      onSuccess: (saved) => {
        setStatusMessage(
          saved.status === 'cancelled' ? 'The visit is cancelled.' : 'The visit is booked again.',
        );
        onChanged(saved);
      },
    },
  });
  const setStatus = (status: 'scheduled' | 'cancelled') => {
    setStatusMessage('');
    changeStatus.mutate({
      siteId: visit.siteId,
      visitId: visit.id,
      data: { version: visit.version, status },
    });
  };

  if (visit.status === 'done')
    return <p className="text-sm">This visit is done; its record can no longer be changed.</p>;

  return (
    <div className="grid gap-5 border-t border-hairline pt-4">
      {visit.status === 'scheduled' ? (
        // Keyed by visit: the form starts from the visit it was opened for.
        <MoveVisitForm
          key={visit.id}
          visit={visit}
          engineers={engineers}
          reloadVisit={reloadVisit}
          onMoved={onChanged}
        />
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        {visit.status === 'scheduled' ? (
          <ConfirmButton
            question="Cancel this visit? It stays in the schedule, marked cancelled."
            confirmLabel="Cancel the visit"
            cancelLabel="Keep it"
            pending={changeStatus.isPending}
            onConfirm={() => setStatus('cancelled')}
          >
            Cancel visit
          </ConfirmButton>
        ) : (
          <ConfirmButton
            question="Book this visit again, as it was before it was cancelled?"
            confirmLabel="Book it again"
            cancelLabel="Leave it cancelled"
            pending={changeStatus.isPending}
            onConfirm={() => setStatus('scheduled')}
          >
            Book again
          </ConfirmButton>
        )}
        <p role="status" className="text-sm font-semibold">
          {statusMessage}
        </p>
      </div>
      {changeStatus.error ? (
        <ProblemAlert
          error={changeStatus.error}
          title={
            visit.status === 'scheduled'
              ? 'The visit was not cancelled.'
              : 'The visit was not booked again.'
          }
        />
      ) : null}
    </div>
  );
}
