import type { ServicePlanView } from '@server/service/schema';
import { SIGNALLING_LABELS } from '@server/calc/service-plan';
import { CalendarCheck, CalendarClock } from 'lucide-react';
import type { ReactNode } from 'react';

import { Card } from '@/components/ui/card';
import { DetailItem } from '@/components/ui/detail-item';
import { LoadingStatus } from '@/components/ui/loading-status';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { formatCalendarDate } from '@/lib/dates';
import { useServicePlan } from '@/features/service/api/get-service-plan';
import { daysOverdueWords, describeBooking } from '@/features/service/utils/visit-words';

type Audience = 'staff' | 'homeowner';

function visitsAYear(count: number): string {
  return count === 1 ? '1 preventive visit a year' : `${count} preventive visits a year`;
}

function countedFrom(plan: ServicePlanView): string | null {
  if (!plan.countsFromOn) return null;
  const on = formatCalendarDate(plan.countsFromOn);
  if (plan.countsFrom === 'last_preventive_visit') return `the last preventive visit, on ${on}`;
  return plan.inServiceBasis === 'handover' ? `handover, on ${on}` : `commissioning, on ${on}`;
}

function bookedVisitWords(booked: NonNullable<ServicePlanView['bookedVisit']>): string {
  const engineer = booked.engineerName ? ` with ${booked.engineerName}` : '';
  const due = `due ${formatCalendarDate(booked.dueDate)}`;
  return booked.scheduledFor
    ? `${describeBooking(booked.scheduledFor)}${engineer} (${due})`
    : `Planned, no day given yet${engineer} (${due})`;
}

/** Overdue, due today or not yet due, in words (the notice's colour only repeats it). */
function DueStanding({ plan, audience }: { plan: ServicePlanView; audience: Audience }) {
  if (!plan.nextDueOn) {
    return (
      <Notice tone="info" title="No due date yet">
        {audience === 'staff'
          ? 'The plan counts from handover or, before a pack is issued, the last commissioning test. Neither is recorded yet.'
          : 'Your first service visit falls due once the system has been handed over to you.'}
      </Notice>
    );
  }
  if (plan.overdue) {
    return (
      <Notice tone="fault" title={`Overdue: ${daysOverdueWords(plan.daysOverdue)}`}>
        The preventive visit was due on {formatCalendarDate(plan.nextDueOn)}.
        {audience === 'homeowner'
          ? ' If your alarm company has not been in touch, ask them to book it.'
          : null}
      </Notice>
    );
  }
  return (
    <Notice
      tone="normal"
      title={plan.nextDueOn === plan.today ? 'Due today' : 'Not overdue'}
      icon={CalendarCheck}
    >
      Next preventive visit due on {formatCalendarDate(plan.nextDueOn)}.
    </Notice>
  );
}

type ServicePlanCardProps = {
  siteId: string;
  audience: Audience;
  /** Links under the plan, e.g. the office's "Book a visit". */
  actions?: ReactNode;
};

/**
 * The site's service plan as the API works it out: visits a year from the signalling, the rule
 * and its source word for word (a recalled value, so it is shown as given, never reworded),
 * the next due date and whether it is overdue.
 */
export function ServicePlanCard({ siteId, audience, actions }: ServicePlanCardProps) {
  const { data: plan, isPending, error } = useServicePlan(siteId);
  const title = audience === 'homeowner' ? 'Service plan for your system' : 'Service plan';
  return (
    <Card title={title} icon={CalendarClock}>
      {isPending ? (
        <LoadingStatus label="Loading the service plan" />
      ) : error ? (
        <ProblemAlert error={error} title="The service plan could not be loaded." />
      ) : (
        <div className="grid gap-4 text-sm">
          <DueStanding plan={plan} audience={audience} />
          <dl className="grid gap-3">
            <DetailItem term="Visits a year">
              <span className="font-semibold">{visitsAYear(plan.visitsPerYear)}</span>
              {` (${SIGNALLING_LABELS[plan.signalling].toLowerCase()})`}
            </DetailItem>
            {audience === 'staff' ? (
              <DetailItem term="Why">{plan.signallingReason}</DetailItem>
            ) : null}
            <DetailItem term="Rule">{plan.rule}</DetailItem>
            <DetailItem term="Source">{plan.source}</DetailItem>
            <DetailItem term="Next due">
              {plan.nextDueOn ? formatCalendarDate(plan.nextDueOn) : 'Not set yet'}
            </DetailItem>
            {countedFrom(plan) ? (
              <DetailItem term="Counted from">{countedFrom(plan)}</DetailItem>
            ) : null}
            <DetailItem term="Booked visit">
              {plan.bookedVisit ? bookedVisitWords(plan.bookedVisit) : 'None booked yet'}
            </DetailItem>
          </dl>
          {plan.planChange ? (
            <p>
              The plan changed from {plan.planChange.fromVisitsPerYear} to{' '}
              {plan.planChange.toVisitsPerYear} visits a year since that date, so the next visit is
              counted with the new plan&apos;s interval of {plan.intervalMonths} months.
            </p>
          ) : null}
          {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
        </div>
      )}
    </Card>
  );
}
