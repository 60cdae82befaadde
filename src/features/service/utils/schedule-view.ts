import { z } from 'zod';

import { monthOf, monthRange, parseMonth } from '@/features/service/utils/uk-calendar';
import type { ScheduleRange } from '@/features/service/api/get-service-schedule';

export type ScheduleLayout = 'list' | 'calendar';

/** What the schedule shows, kept in the address bar so reload and back bring it again. */
export type ScheduleView = {
  month: string;
  layout: ScheduleLayout;
  /** The office's engineer filter; an engineer always sees only their own visits. */
  engineerId?: string;
  /** The visit whose details are open. */
  visitId?: string;
  /** The site the booking form opens for (from the overdue list or a site's plan). */
  bookSiteId?: string;
};

const uuid = z.uuid();
const idOrUndefined = (value: string | null) =>
  uuid.safeParse(value).success ? value! : undefined;

/** A hand-edited or outdated value is dropped rather than refused, so old links still open. */
export function readScheduleView(params: URLSearchParams, today: string): ScheduleView {
  return {
    month: parseMonth(params.get('month')) ?? monthOf(today),
    layout: params.get('view') === 'calendar' ? 'calendar' : 'list',
    engineerId: idOrUndefined(params.get('engineer')),
    visitId: idOrUndefined(params.get('visit')),
    bookSiteId: idOrUndefined(params.get('book')),
  };
}

export function scheduleSearchParams(view: ScheduleView, today: string): URLSearchParams {
  const params = new URLSearchParams();
  if (view.month !== monthOf(today)) params.set('month', view.month);
  if (view.layout !== 'list') params.set('view', view.layout);
  if (view.engineerId) params.set('engineer', view.engineerId);
  if (view.visitId) params.set('visit', view.visitId);
  if (view.bookSiteId) params.set('book', view.bookSiteId);
  return params;
}

/** The API request behind the view; `ownEngineerId` pins an engineer to their own visits. */
export function scheduleRangeOf(view: ScheduleView, ownEngineerId?: string): ScheduleRange {
  const engineerId = ownEngineerId ?? view.engineerId;
  return { ...monthRange(view.month), ...(engineerId ? { engineerId } : {}) };
}
