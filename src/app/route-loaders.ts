import type { QueryClient } from '@tanstack/react-query';
import { data, redirect, redirectDocument, type LoaderFunctionArgs } from 'react-router-dom';

import { paths } from '@/config/paths';
import { getMeQueryOptions, type Me } from '@/features/auth/api/get-me';
import { firstRole, hasRole } from '@/features/auth/utils/role-grants';
import { getRoleHomeQueryOptions } from '@/features/homes/api/get-role-home';
import { roleHomeHref, roleLabels } from '@/lib/roles';
import type { Role } from '@/types/api';

/*
 * Loaders fill the query cache before a screen renders; the screen then reads the same data
 * with useSuspenseQuery. They live in a plain module so that route modules export components only.
 */

// Sign-in is served by the API and leaves the app, so the browser must load it as a document.
function sendToSignIn(request: Request): Response {
  const url = new URL(request.url);
  return redirectDocument(paths.auth.login.getHref(`${url.pathname}${url.search}`));
}

function requireSignedIn(me: Me | null, request: Request): Me {
  if (!me) throw sendToSignIn(request);
  return me;
}

/** Where a signed-in person lands: their first role's home, or /app if they have none yet. */
function startingPoint(me: Me): string {
  const role = firstRole(me);
  return role ? roleHomeHref(role) : paths.app.getHref();
}

export type LandingLoaderData = {
  /** 'unavailable' when the API could not say whether anyone is signed in. */
  sessionCheck: 'signed-out' | 'unavailable';
};

export const landingLoader = (queryClient: QueryClient) => async (): Promise<LandingLoaderData> => {
  let me: Me | null;
  try {
    me = await queryClient.ensureQueryData(getMeQueryOptions());
  } catch {
    // The landing page still works without the API: it explains and offers sign-in.
    return { sessionCheck: 'unavailable' };
  }
  if (me) throw redirect(startingPoint(me));
  return { sessionCheck: 'signed-out' };
};

/** /app: sends a signed-in person to their first role's home; without roles, it shows why. */
export const appEntryLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = requireSignedIn(await queryClient.ensureQueryData(getMeQueryOptions()), request);
    const role = firstRole(me);
    if (role) throw redirect(roleHomeHref(role));
    return null;
  };

/** For layout routes: the frame needs the signed-in person before it can draw its header. */
export const signedInLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    requireSignedIn(await queryClient.ensureQueryData(getMeQueryOptions()), request);
    return null;
  };

/** A role's home: signed in, holding the role, and that role's summary in the cache. */
export const roleHomeLoader =
  (queryClient: QueryClient, role: Role) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = requireSignedIn(await queryClient.ensureQueryData(getMeQueryOptions()), request);
    if (!hasRole(me, role)) {
      throw data({ roleLabel: roleLabels[role] }, { status: 403, statusText: 'Forbidden' });
    }
    await queryClient.ensureQueryData({
      ...getRoleHomeQueryOptions(role),
      revalidateIfStale: true,
    });
    return null;
  };

/** Any page of a role: signed in and holding that role (403 inside the role's frame if not). */
export const roleLoader =
  (queryClient: QueryClient, role: Role) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = requireSignedIn(await queryClient.ensureQueryData(getMeQueryOptions()), request);
    if (!hasRole(me, role)) {
      throw data({ roleLabel: roleLabels[role] }, { status: 403, statusText: 'Forbidden' });
    }
    return null;
  };
