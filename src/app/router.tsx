import { useMemo, type ComponentType } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';

import { appEntryLoader, landingLoader, roleHomeLoader, signedInLoader } from '@/app/route-loaders';
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

function roleHomeRoute(queryClient: QueryClient, role: Role): RouteObject {
  return {
    path: paths.home[role].path,
    handle: { role } satisfies RoleRouteHandle,
    loader: roleHomeLoader(queryClient, role),
    // Static rather than lazy, so a refusal renders even if the screen's code fails to load.
    ErrorBoundary: RoleRouteErrorRoute,
    lazy: async () => ({ Component: await roleHomeScreens[role]() }),
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
          children: rolesWithLayout('workspace').map((role) => roleHomeRoute(queryClient, role)),
        },
        {
          // Personal roles (homeowner, keyholder): phone-first frame.
          loader: signedInLoader(queryClient),
          lazy: async () => ({
            Component: (await import('@/app/routes/app/personal-layout')).PersonalLayoutRoute,
          }),
          children: rolesWithLayout('personal').map((role) => roleHomeRoute(queryClient, role)),
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
