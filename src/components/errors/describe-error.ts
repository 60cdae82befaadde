import { isRouteErrorResponse } from 'react-router-dom';

import { env } from '@/config/env';
import { ApiError, NetworkError } from '@/lib/api-client';

export type ErrorKind = 'signed-out' | 'not-allowed' | 'not-found' | 'unreachable' | 'failed';

export type ErrorDescription = {
  kind: ErrorKind;
  heading: string;
  message: string;
  /** Quoted to support so they can find the request in the server's logs. */
  reference?: string;
  /** Only in development: the raw message, to save a trip to the console. */
  technicalDetail?: string;
};

const notAllowedHeading = 'Not available to your account';
const askAnAdministrator =
  'If you think it should be, ask whoever manages accounts at your alarm company or monitoring centre.';

function roleLabelFrom(data: unknown): string | undefined {
  if (typeof data !== 'object' || data === null || !('roleLabel' in data)) return undefined;
  return typeof data.roleLabel === 'string' ? data.roleLabel : undefined;
}

function notAllowed(roleLabel?: string, detail?: string): ErrorDescription {
  const message = roleLabel
    ? `This page is for the ${roleLabel} role, which your account does not have. ${askAnAdministrator}`
    : (detail ?? `Your account cannot open this page. ${askAnAdministrator}`);
  return { kind: 'not-allowed', heading: notAllowedHeading, message };
}

const notFound = (detail?: string): ErrorDescription => ({
  kind: 'not-found',
  heading: 'Page not found',
  message: detail ?? 'There is nothing here. The link may be out of date.',
});

const signedOut: ErrorDescription = {
  kind: 'signed-out',
  heading: 'You have been signed out',
  message: 'Your session has ended. Sign in again to carry on where you were.',
};

/** Turns anything a loader or component threw into words for the person in front of it. */
export function describeError(error: unknown): ErrorDescription {
  if (isRouteErrorResponse(error)) {
    if (error.status === 401) return signedOut;
    if (error.status === 403) return notAllowed(roleLabelFrom(error.data));
    if (error.status === 404) return notFound();
    return {
      kind: 'failed',
      heading: 'Something went wrong',
      message: 'This page could not be shown. Try again in a moment.',
      technicalDetail: env.DEV ? `${error.status} ${error.statusText}` : undefined,
    };
  }

  if (error instanceof ApiError) {
    if (error.status === 401) return signedOut;
    if (error.status === 403) return notAllowed(undefined, error.detail);
    if (error.status === 404) return notFound(error.detail);
    return {
      kind: 'failed',
      heading: error.title,
      message:
        error.detail ??
        (error.requestId
          ? 'Try again in a moment. If it keeps happening, tell your Wardbook administrator and quote the reference below.'
          : 'Try again in a moment. If it keeps happening, tell your Wardbook administrator.'),
      reference: error.requestId,
    };
  }

  if (error instanceof NetworkError) {
    return { kind: 'unreachable', heading: 'Cannot reach Wardbook', message: error.message };
  }

  return {
    kind: 'failed',
    heading: 'Something went wrong',
    message: 'This page hit an unexpected problem. Reloading usually clears it.',
    technicalDetail: env.DEV && error instanceof Error ? error.message : undefined,
  };
}
