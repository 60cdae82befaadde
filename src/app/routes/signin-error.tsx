import { LogIn } from 'lucide-react';
import { Link, useSearchParams } from 'react-router-dom';

import { PublicLayout } from '@/components/layouts/public-layout';
import { buttonClassName } from '@/components/ui/button-styles';
import { paths } from '@/config/paths';

// The codes the API puts in ?reason= when a sign-in fails.
type SigninFailureReason =
  | 'state_mismatch'
  | 'code_rejected'
  | 'provider_error'
  | 'no_account'
  | 'second_factor_missing'
  | 'access_denied'
  | 'unknown';

const explanations: Record<SigninFailureReason, string> = {
  state_mismatch:
    'The sign-in could not be matched to this browser. This happens when it takes too long, is started in another tab or window, or the page is reloaded part-way through. Starting again usually works.',
  code_rejected:
    'The sign-in service’s answer could not be confirmed. It may have expired or already been used. Starting again usually works.',
  provider_error:
    'The sign-in service had a problem and could not finish signing you in. Wait a moment, then try again.',
  no_account:
    'You signed in, but no Wardbook account is linked to that identity. Accounts are by invitation: ask your alarm company or monitoring centre to invite you, or use the link in your invitation e-mail.',
  second_factor_missing:
    'Engineers, office staff and monitoring-centre operators must confirm sign-in with a one-time code from an authenticator app as well as their password, and this sign-in finished without one. Sign in again and enter the code when asked.',
  access_denied: 'The sign-in was cancelled or permission was not given, so you are not signed in.',
  unknown: 'Something went wrong while signing you in, and Wardbook could not tell what.',
};

function isKnownReason(reason: string | null): reason is SigninFailureReason {
  return reason !== null && Object.hasOwn(explanations, reason);
}

export function SigninErrorRoute() {
  const [searchParams] = useSearchParams();
  const reasonParam = searchParams.get('reason');
  const reason: SigninFailureReason = isKnownReason(reasonParam) ? reasonParam : 'unknown';

  return (
    <PublicLayout>
      <title>Sign-in did not work · Wardbook</title>
      <div className="mx-auto max-w-2xl px-4 py-12 md:px-6">
        <h1 className="text-2xl font-semibold tracking-tight md:text-3xl">
          We could not sign you in
        </h1>
        <p className="mt-4 text-lg">{explanations[reason]}</p>
        <p className="mt-3 text-sm text-ink-muted">
          If you ask for help, quote this reason:{' '}
          <span className="font-mono text-ink">{reason}</span>
        </p>
        <div className="mt-8 flex flex-wrap gap-3">
          {/* A plain link: sign-in is served by the API, outside the app. */}
          <a href={paths.auth.login.getHref()} className={buttonClassName({ size: 'lg' })}>
            <LogIn aria-hidden="true" className="size-5" />
            Try signing in again
          </a>
          <Link
            to={paths.landing.getHref()}
            className={buttonClassName({ variant: 'secondary', size: 'lg' })}
          >
            Go to the start page
          </Link>
        </div>
      </div>
    </PublicLayout>
  );
}
