import type { Role } from '@/types/api';

/** Roles that work on the installer's site records. */
export type SiteRole = 'engineer' | 'office';
export const SITE_SECTIONS = [
  'system',
  'zones',
  'devices',
  'people',
  'files',
  'commissioning',
  'handover',
] as const;
export type SiteSection = (typeof SITE_SECTIONS)[number];
export const MY_HOME_SECTIONS = [
  'zones',
  'keyholders',
  'user-codes',
  'files',
  'signals',
  'service',
  'request',
] as const;
export type MyHomeSection = (typeof MY_HOME_SECTIONS)[number];

function withQuery(path: string, query: Record<string, string | undefined>): string {
  const search = new URLSearchParams();
  for (const [name, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') search.set(name, value);
  }
  const queryString = search.toString();
  return queryString ? `${path}?${queryString}` : path;
}

export const paths = {
  landing: { path: '/', getHref: () => '/' },
  // Entry point after sign-in: sends the person to the home of their first role.
  app: { path: '/app', getHref: () => '/app' },
  signinError: {
    path: '/signin-error',
    getHref: (reason?: string) => withQuery('/signin-error', { reason }),
  },
  home: {
    engineer: { path: '/engineer', getHref: () => '/engineer' },
    office: { path: '/office', getHref: () => '/office' },
    operator: { path: '/operator', getHref: () => '/operator' },
    homeowner: { path: '/homeowner', getHref: () => '/homeowner' },
    keyholder: { path: '/keyholder', getHref: () => '/keyholder' },
  },
  // Engineers and office staff work on the same site pages under their own role's prefix.
  sites: {
    list: { path: 'sites', getHref: (role: SiteRole) => `/${role}/sites` },
    create: { path: 'sites/new', getHref: (role: SiteRole) => `/${role}/sites/new` },
    workspace: {
      path: 'sites/:siteId',
      getHref: (role: SiteRole, siteId: string, section?: SiteSection) =>
        `/${role}/sites/${encodeURIComponent(siteId)}${section ? `/${section}` : ''}`,
    },
  },
  // The engineering calculators, for engineers and office staff alike.
  calculators: {
    path: 'calculators',
    getHref: (role: SiteRole) => `/${role}/calculators`,
  },
  // The company's service visits: the office books and moves them, engineers see their own.
  // `book` opens the booking form for that site; `visit` opens one visit's details.
  service: {
    path: 'service',
    getHref: (role: SiteRole, query: { book?: string; visit?: string; month?: string } = {}) =>
      withQuery(`/${role}/service`, query),
  },
  // The engineer's form for finishing one visit on site; `day` is the day the schedule shows
  // it on, so the visit is found in that stretch of the schedule.
  completeVisit: {
    path: 'service/visits/:visitId/complete',
    getHref: (visitId: string, day: string) =>
      withQuery(`/engineer/service/visits/${encodeURIComponent(visitId)}/complete`, { day }),
  },
  // A homeowner's own site, phone-first.
  myHome: {
    path: 'homes/:siteId',
    getHref: (siteId: string, section?: MyHomeSection) =>
      `/homeowner/homes/${encodeURIComponent(siteId)}${section ? `/${section}` : ''}`,
  },
  // A homeowner's handover packs, across all their homes, and the countersigning page that the
  // e-mailed signing request links to.
  documents: { path: 'documents', getHref: () => '/homeowner/documents' },
  signingRequest: {
    path: 'sign/:requestId',
    getHref: (requestId: string) => `/homeowner/sign/${encodeURIComponent(requestId)}`,
  },
  // One alarm event on the operator's queue: take it, call keyholders, close it.
  monitoringEvent: {
    path: 'events/:eventId',
    getHref: (eventId: string) => `/operator/events/${encodeURIComponent(eventId)}`,
  },
  // The installer company's settings, for office staff: pack numbering and the sealing key.
  officeSettings: { path: 'settings', getHref: () => '/office/settings' },
  // Public, no sign-in: anyone holding a pack can check its seal and status.
  verify: {
    lookup: { path: '/verify', getHref: () => '/verify' },
    pack: {
      path: '/verify/:packNumber',
      getHref: (packNumber: string) => `/verify/${encodeURIComponent(packNumber)}`,
    },
  },
  // Served by the API, not the client router: always reached by a full-page navigation.
  auth: {
    login: {
      path: '/auth/login',
      getHref: (returnTo?: string) => withQuery('/auth/login', { returnTo }),
    },
    logout: { path: '/auth/logout', getHref: () => '/auth/logout' },
  },
  api: {
    me: { path: '/api/me', getHref: () => '/api/me' },
    roleHome: {
      path: '/api/homes/:role',
      getHref: (role: Role) => `/api/homes/${encodeURIComponent(role)}`,
    },
  },
} as const;
