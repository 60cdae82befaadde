import { useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';

import type { CompletedVisit, ServiceVisit } from '@server/service/schema';
import type { SystemRecord } from '@server/systems/schema';
import { buttonClassName } from '@/components/ui/button-styles';
import { EngineerSafetyCard } from '@/components/ui/engineer-safety-card';
import { PageHeading } from '@/components/ui/page-heading';
import { paths } from '@/config/paths';
import {
  getSiteEngineeringQueryOptions,
  useSiteEngineering,
} from '@/features/engineering/api/get-site-engineering';
import { getServiceScheduleQueryOptions } from '@/features/service/api/get-service-schedule';
import { CompletedVisitSummary } from '@/features/service/components/completed-visit-summary';
import { CorrectiveVisitForm } from '@/features/service/components/corrective-visit-form';
import {
  PreventiveVisitForm,
  type VisitSignallingPath,
  type VisitZone,
} from '@/features/service/components/preventive-visit-form';
import { forgetCompletionKey } from '@/features/service/utils/completion-key';
import { ukToday } from '@/features/service/utils/uk-calendar';
import { kindLabel } from '@/features/service/utils/visit-words';
import { getSystemQueryOptions, useSystem } from '@/features/systems/api/get-system';
import { formatCalendarDate } from '@/lib/dates';

/** The schedule around the day the visit is shown on: well inside the API's longest stretch. */
function rangeAround(day: string) {
  const shift = (days: number) => {
    const date = new Date(`${day}T12:00:00Z`);
    date.setUTCDate(date.getUTCDate() + days);
    return date.toISOString().slice(0, 10);
  };
  return { from: shift(-40), to: shift(40) };
}

function readDay(search: URLSearchParams): string {
  const day = search.get('day') ?? '';
  return /^\d{4}-\d{2}-\d{2}$/.test(day) ? day : ukToday();
}

export function createLoader(queryClient: QueryClient) {
  return async ({ params, request }: LoaderFunctionArgs) => {
    const range = rangeAround(readDay(new URL(request.url).searchParams));
    const schedule = await queryClient.ensureQueryData(getServiceScheduleQueryOptions(range));
    const visit = schedule.visits.find((candidate) => candidate.id === params.visitId);
    if (!visit) throw new Response('No such visit on your schedule', { status: 404 });
    // Everything the form needs is fetched up front, so it keeps working if the signal drops.
    await Promise.all([
      queryClient.ensureQueryData(getSiteEngineeringQueryOptions(visit.siteId)),
      queryClient.ensureQueryData(getSystemQueryOptions(visit.siteId)),
    ]);
    return null;
  };
}

const BEARER_NAMES: Record<SystemRecord['signallingPaths'][number]['bearer'], string> = {
  ip: 'IP',
  cellular: 'cellular',
  pstn: 'telephone line',
  radio: 'radio',
};

function pathsOf(system: SystemRecord | null): VisitSignallingPath[] {
  return (system?.signallingPaths ?? []).map((path) => ({
    id: path.id,
    description: [
      `Path ${path.position}${path.position === 1 ? ' (primary)' : ''}: ${BEARER_NAMES[path.bearer]}`,
      path.atsCategory,
      path.description,
    ]
      .filter(Boolean)
      .join(', '),
  }));
}

/** The engineer finishing a visit on site: the checklist or the call-out record, phone-first. */
export function Component() {
  const { visitId = '' } = useParams();
  const [searchParams] = useSearchParams();
  const range = rangeAround(readDay(searchParams));
  const { data: schedule } = useSuspenseQuery(getServiceScheduleQueryOptions(range));
  const visit = schedule.visits.find((candidate) => candidate.id === visitId);
  if (!visit) throw new Response('No such visit on your schedule', { status: 404 });
  return <CompleteVisitScreen visit={visit} />;
}

function CompleteVisitScreen({ visit }: { visit: ServiceVisit }) {
  const { data: engineering } = useSiteEngineering(visit.siteId);
  const { data: system } = useSystem(visit.siteId);
  const queryClient = useQueryClient();
  const [completed, setCompleted] = useState<CompletedVisit | null>(null);
  const zones: VisitZone[] = (engineering?.zones ?? []).map((zone) => ({
    zoneId: zone.zoneId,
    number: zone.number,
    location: zone.location,
    design: zone.design,
    bands: zone.bands,
  }));
  const onCompleted = (saved: CompletedVisit) => {
    forgetCompletionKey(visit.id);
    setCompleted(saved);
    void queryClient.invalidateQueries({ queryKey: ['service'] });
    window.scrollTo({ top: 0 });
  };
  const scheduleHref = paths.service.getHref('engineer', { visit: visit.id });

  return (
    <>
      <title>{`Complete ${kindLabel(visit).toLowerCase()} · ${visit.siteName} · Wardbook`}</title>
      <div className="mx-auto grid max-w-2xl gap-5">
        <PageHeading title="Complete this visit">
          <p>
            {kindLabel(visit)} at <span className="font-mono">{visit.siteReference}</span>{' '}
            {visit.siteName}, {visit.siteTown}. Due {formatCalendarDate(visit.dueDate)}.
          </p>
        </PageHeading>
        {completed ? (
          <CompletedVisitSummary visit={completed} />
        ) : visit.status !== 'scheduled' ? (
          <p className="rounded-lg border border-hairline bg-white px-4 py-4">
            This visit is {visit.status === 'done' ? 'already completed' : 'cancelled'}: there is
            nothing more to record on it.
          </p>
        ) : (
          <>
            <EngineerSafetyCard />
            {visit.kind === 'preventive' ? (
              <PreventiveVisitForm
                visit={visit}
                zones={zones}
                signallingPaths={pathsOf(system)}
                onCompleted={onCompleted}
              />
            ) : (
              <CorrectiveVisitForm visit={visit} onCompleted={onCompleted} />
            )}
          </>
        )}
        <p>
          <Link to={scheduleHref} className={buttonClassName({ variant: 'secondary' })}>
            Back to the schedule
          </Link>
        </p>
      </div>
    </>
  );
}
