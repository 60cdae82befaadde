import { Link, useLocation } from 'react-router-dom';

import { PublicLayout } from '@/components/layouts/public-layout';
import { buttonClassName } from '@/components/ui/button-styles';
import { paths } from '@/config/paths';

export function NotFoundRoute() {
  const { pathname } = useLocation();

  return (
    <PublicLayout>
      <title>Page not found · Wardbook</title>
      <div className="mx-auto max-w-2xl px-4 py-12 md:px-6">
        <h1 className="text-2xl font-semibold tracking-tight md:text-3xl">Page not found</h1>
        <p className="mt-4 text-ink-muted">
          There is no page at <span className="font-mono break-all text-ink">{pathname}</span>.
          Check the address, or start again from the front page.
        </p>
        <div className="mt-8">
          <Link to={paths.landing.getHref()} className={buttonClassName({ size: 'lg' })}>
            Go to the start page
          </Link>
        </div>
      </div>
    </PublicLayout>
  );
}
