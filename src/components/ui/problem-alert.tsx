import type { ReactNode } from 'react';
import { TriangleAlert } from 'lucide-react';

import { ApiError, NetworkError, type FieldError } from '@/lib/api-client';
import { cn } from '@/utils/cn';

type ProblemAlertProps = {
  error: unknown;
  /**
   * What did not happen, in words ("The event was not taken."), in place of the API's own title;
   * the API's reason then follows it.
   */
  title?: string;
  /** Field errors no field on the form could show. */
  leftoverFieldErrors?: readonly FieldError[];
  /** A sentence that helps with this particular failure, e.g. which file types are accepted. */
  hint?: ReactNode;
  /** A next step, e.g. a "Reload latest" button. */
  action?: ReactNode;
  className?: string;
};

function describe(error: unknown): { title: string; detail?: string; reference?: string } {
  if (error instanceof ApiError) {
    return { title: error.title, detail: error.detail, reference: error.requestId };
  }
  if (error instanceof NetworkError) return { title: error.message };
  return { title: 'Something went wrong. Try again in a moment.' };
}

/** Why a request failed, read out as soon as it appears, in words and with an icon. */
export function ProblemAlert({
  error,
  title: what,
  leftoverFieldErrors = [],
  hint,
  action,
  className,
}: ProblemAlertProps) {
  const described = describe(error);
  const title = what ?? described.title;
  // Without the API's detail, its own title is the only reason there is: keep it under ours.
  const detail = what ? (described.detail ?? described.title) : described.detail;
  const { reference } = described;
  return (
    <div
      role="alert"
      className={cn(
        'flex gap-3 rounded-md border border-l-4 border-hairline border-l-alarm bg-white p-4',
        className,
      )}
    >
      <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-alarm" />
      <div className="grid gap-2">
        <p className="font-semibold">{title}</p>
        {detail ? <p className="text-sm">{detail}</p> : null}
        {hint ? <p className="text-sm">{hint}</p> : null}
        {leftoverFieldErrors.length > 0 ? (
          <ul className="list-disc pl-5 text-sm">
            {leftoverFieldErrors.map((fieldError) => (
              <li key={`${fieldError.path}:${fieldError.message}`}>{fieldError.message}</li>
            ))}
          </ul>
        ) : null}
        {reference ? (
          <p className="text-sm text-ink-muted">
            Reference: <span className="font-mono text-ink">{reference}</span>
          </p>
        ) : null}
        {action ? <div className="flex flex-wrap gap-2">{action}</div> : null}
      </div>
    </div>
  );
}
