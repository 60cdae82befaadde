import type { ServiceVisit } from '@server/service/schema';
import { CircleCheck, CircleSlash, Clock, TriangleAlert } from 'lucide-react';

import { isPastDue, VISIT_STATUS_LABELS } from '@/features/service/utils/visit-words';
import { cn } from '@/utils/cn';

/** The visit's status as a word with an icon; a visit still to do after its due date says so. */
export function VisitStatusWords({
  visit,
  today,
  className,
}: {
  visit: Pick<ServiceVisit, 'status' | 'dueDate'>;
  today: string;
  className?: string;
}) {
  const pastDue = isPastDue(visit, today);
  const Icon = pastDue
    ? TriangleAlert
    : visit.status === 'done'
      ? CircleCheck
      : visit.status === 'cancelled'
        ? CircleSlash
        : Clock;
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 whitespace-nowrap',
        pastDue && 'font-semibold text-fault-text',
        visit.status === 'done' && 'text-normal',
        className,
      )}
    >
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      {VISIT_STATUS_LABELS[visit.status]}
      {pastDue ? ', past its due date' : null}
    </span>
  );
}
