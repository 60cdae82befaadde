import { useMemo, type ComponentType } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import {
  createBrowserRouter,
  RouterProvider,
  type LoaderFunction,
  type RouteObject,
} from 'react-router-dom';

import {
  appEntryLoader,
  landingLoader,
  roleHomeLoader,
  roleLoader,
  signedInLoader,
} from '@/app/route-loaders';
import { RoleRouteErrorRoute } from '@/app/routes/app/role-route-error';
import { RootRoute } from '@/app/routes/root';
import { RouteErrorPage } from '@/components/errors/route-error-page';
import { FullPageLoading } from '@/components/ui/loading-status';
import { paths } from '@/config/paths';
import { roleLayouts, type RoleLayout, type RoleRouteHandle } from '@/lib/roles';
import { roleSchema, type Role } from '@/types/api';

// Screens load on demand; loaders are static so data and code are fetched side by side.
const roleHomeScreens: Record<Role, () => Promise<ComponentType>> = {
  engineer: async () => (await import('@/app/routes/app/engineer-home')).EngineerHomeRoute,
  office: async () => (await import('@/app/routes/app/office-home')).OfficeHomeRoute,
  operator: async () => (await import('@/app/routes/app/operator-home')).OperatorHomeRoute,
  homeowner: async () => (await import('@/app/routes/app/homeowner-home')).HomeownerHomeRoute,
  keyholder: async () => (await import('@/app/routes/app/keyholder-home')).KeyholderHomeRoute,
};

function rolesWithLayout(layout: RoleLayout): Role[] {
  return roleSchema.options.filter((role) => roleLayouts[role] === layout);
}

/**
 * A screen module exports `Component` and, when it needs data first, `createLoader(queryClient)`;
 * both arrive together when the route is first visited.
 */
type ScreenModule = {
  Component: ComponentType;
  createLoader?: (queryClient: QueryClient) => LoaderFunction;
};

function screen(queryClient: QueryClient, load: () => Promise<ScreenModule>): RouteObject['lazy'] {
  return async () => {
    const module = await load();
    return {
      Component: module.Component,
      ...(module.createLoader ? { loader: module.createLoader(queryClient) } : {}),
    };
  };
}

// The installer's site record: list, create, and a workspace with one section per child route.
function siteRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.sites.list.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/sites/sites-list')),
    },
    {
      path: paths.sites.create.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-create')),
    },
    {
      path: paths.sites.workspace.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-workspace')),
      children: [
        {
          index: true,
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-overview')),
        },
        {
          path: 'system',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-system')),
        },
        {
          path: 'zones',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-zones')),
        },
        {
          path: 'devices',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-devices')),
        },
        {
          path: 'people',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-people')),
        },
        {
          path: 'files',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-files')),
        },
        {
          path: 'commissioning',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-commissioning')),
        },
        {
          path: 'handover',
          lazy: screen(queryClient, () => import('@/app/routes/app/sites/site-handover')),
        },
      ],
    },
  ];
}

// Engineers and office staff: the site record, and the calculators the record's checks use.
function staffRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    ...siteRoutes(queryClient),
    {
      path: paths.calculators.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/calculators')),
    },
    {
      path: paths.service.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/service-schedule')),
    },
  ];
}

// Engineers also finish their visits on site, on a phone.
function engineerRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    ...staffRoutes(queryClient),
    {
      path: paths.completeVisit.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/service-visit-complete')),
    },
  ];
}

// Office staff also keep the company's settings: pack numbering and the sealing key.
function officeRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    ...staffRoutes(queryClient),
    {
      path: paths.officeSettings.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/office-settings')),
    },
  ];
}

// A homeowner's own site: an overview and one page per section, each phone-first.
function myHomeRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.myHome.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home')),
      children: [
        {
          index: true,
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-overview')),
        },
        {
          path: 'zones',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-zones')),
        },
        {
          path: 'keyholders',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-keyholders')),
        },
        {
          path: 'user-codes',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-user-codes')),
        },
        {
          path: 'files',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-files')),
        },
        {
          path: 'signals',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-signals')),
        },
        {
          path: 'service',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-service')),
        },
        {
          path: 'request',
          lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-home-request')),
        },
      ],
    },
  ];
}

// A homeowner's own sites, each phone-first with a page per section; their handover packs
// across every home; and the page an e-mailed signing request links to.
function homeownerRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    ...myHomeRoutes(queryClient),
    {
      path: paths.documents.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/homes/my-documents')),
    },
    {
      path: paths.signingRequest.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/homes/sign-request')),
    },
  ];
}

// Operators: the queue is their home; each alarm event opens on a page of its own.
function operatorRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.monitoringEvent.path,
      lazy: screen(queryClient, () => import('@/app/routes/app/monitoring/alarm-event')),
    },
  ];
}

const roleSubRoutes: Partial<Record<Role, (queryClient: QueryClient) => RouteObject[]>> = {
  engineer: engineerRoutes,
  office: officeRoutes,
  operator: operatorRoutes,
  homeowner: homeownerRoutes,
};

function roleRoute(queryClient: QueryClient, role: Role): RouteObject {
  return {
    path: paths.home[role].path,
    handle: { role } satisfies RoleRouteHandle,
    loader: roleLoader(queryClient, role),
    // Static rather than lazy, so a refusal renders even if the screen's code fails to load.
    ErrorBoundary: RoleRouteErrorRoute,
    children: [
      {
        index: true,
        loader: roleHomeLoader(queryClient, role),
        lazy: async () => ({ Component: await roleHomeScreens[role]() }),
      },
      ...(roleSubRoutes[role]?.(queryClient) ?? []),
    ],
  };
}

function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    {
      path: paths.landing.path,
      Component: RootRoute,
      HydrateFallback: FullPageLoading,
      ErrorBoundary: RouteErrorPage,
      children: [
        {
          index: true,
          loader: landingLoader(queryClient),
          lazy: async () => ({
            Component: (await import('@/app/routes/landing')).LandingRoute,
          }),
        },
        {
          path: paths.signinError.path,
          lazy: async () => ({
            Component: (await import('@/app/routes/signin-error')).SigninErrorRoute,
          }),
        },
        {
          // Public: anyone holding a pack can check its status and seal without signing in.
          path: paths.verify.lookup.path,
          lazy: async () => ({
            Component: (await import('@/app/routes/verify-lookup')).VerifyLookupRoute,
          }),
        },
        {
          path: paths.verify.pack.path,
          lazy: async () => {
            const route = await import('@/app/routes/verify-pack');
            return {
              Component: route.VerifyPackRoute,
              ErrorBoundary: route.VerifyPackError,
              loader: route.createLoader(queryClient),
            };
          },
        },
        {
          path: paths.app.path,
          loader: appEntryLoader(queryClient),
          lazy: async () => ({
            Component: (await import('@/app/routes/app/app-entry')).AppEntryRoute,
          }),
        },
        {
          // Desk roles (engineer, office, operator): wide frame with left navigation.
          loader: signedInLoader(queryClient),
          lazy: async () => ({
            Component: (await import('@/app/routes/app/workspace-layout')).WorkspaceLayoutRoute,
          }),
          children: rolesWithLayout('workspace').map((role) => roleRoute(queryClient, role)),
        },
        {
          // Personal roles (homeowner, keyholder): phone-first frame.
          loader: signedInLoader(queryClient),
          lazy: async () => ({
            Component: (await import('@/app/routes/app/personal-layout')).PersonalLayoutRoute,
          }),
          children: rolesWithLayout('personal').map((role) => roleRoute(queryClient, role)),
        },
        {
          path: '*',
          lazy: async () => ({
            Component: (await import('@/app/routes/not-found')).NotFoundRoute,
          }),
        },
      ],
    },
  ]);
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const router = useMemo(() => createAppRouter(queryClient), [queryClient]);
  return <RouterProvider router={router} />;
}
