import { LogIn, RotateCw } from 'lucide-react';
import { Link, useLocation } from 'react-router-dom';

import { describeError } from '@/components/errors/describe-error';
import { Button } from '@/components/ui/button';
import { buttonClassName } from '@/components/ui/button-styles';
import { paths } from '@/config/paths';

type RouteErrorMessageProps = { error: unknown };

/** The heading, explanation and next step for an error, placed inside whatever frame is around it. */
export function RouteErrorMessage({ error }: RouteErrorMessageProps) {
  const location = useLocation();
  const description = describeError(error);

  return (
    <div className="max-w-2xl">
      <h1 tabIndex={-1} className="text-2xl font-semibold tracking-tight md:text-3xl">
        {description.heading}
      </h1>
      <p className="mt-3 text-ink-muted">{description.message}</p>
      {description.reference ? (
        <p className="mt-3 text-sm text-ink-muted">
          Reference: <span className="font-mono text-ink">{description.reference}</span>
        </p>
      ) : null}
      {description.technicalDetail ? (
        <pre className="mt-4 overflow-x-auto rounded-md border border-hairline bg-white p-3 font-mono text-xs">
          {description.technicalDetail}
        </pre>
      ) : null}
      <div className="mt-6 flex flex-wrap gap-3">
        {description.kind === 'signed-out' ? (
          // Sign-in is served by the API, so this must be a full-page navigation.
          <a
            href={paths.auth.login.getHref(`${location.pathname}${location.search}`)}
            className={buttonClassName({ size: 'lg' })}
          >
            <LogIn aria-hidden="true" className="size-5" />
            Sign in again
          </a>
        ) : null}
        {description.kind === 'unreachable' || description.kind === 'failed' ? (
          <Button size="lg" onClick={() => window.location.reload()}>
            <RotateCw aria-hidden="true" className="size-5" />
            Try again
          </Button>
        ) : null}
        {description.kind === 'not-allowed' ? (
          <Link to={paths.app.getHref()} className={buttonClassName({ size: 'lg' })}>
            Go to your home page
          </Link>
        ) : null}
        {description.kind === 'not-found' ? (
          <Link to={paths.landing.getHref()} className={buttonClassName({ size: 'lg' })}>
            Go to the start page
          </Link>
        ) : null}
      </div>
    </div>
  );
}
