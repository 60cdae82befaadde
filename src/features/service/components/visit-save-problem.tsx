import { RotateCw } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { FormProblem } from '@/components/ui/form-problem';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';

type VisitSaveProblemProps = {
  /** What was being saved, as the start of a sentence: "The visit", "The booking". */
  subject: string;
  fieldErrorCount: number;
  error: unknown;
  unplacedMessages: readonly string[];
  /** Offered after a 409 on a saved visit: start the form again from what is saved now. */
  onReloadLatest?: () => void;
  isReloading?: boolean;
};

/**
 * A 409 on a visit is not always someone else's edit: the visit may have been done or cancelled
 * meanwhile, or the site may already have a preventive visit booked. The API says which, so its
 * words are shown as they come, with what to do next.
 */
export function VisitSaveProblem({
  subject,
  fieldErrorCount,
  error,
  unplacedMessages,
  onReloadLatest,
  isReloading = false,
}: VisitSaveProblemProps) {
  if (error instanceof ApiError && error.status === 409) {
    return (
      <div role="alert">
        <Notice tone="fault" title={`${subject} was not saved`}>
          <p>{error.detail ?? error.title}</p>
          {onReloadLatest ? (
            <>
              <p className="mt-2">
                The details above now show what is saved. Reload latest to start again from that; it
                replaces what you typed, which is still in the form until then.
              </p>
              <Button
                variant="secondary"
                className="mt-3"
                onClick={onReloadLatest}
                disabled={isReloading}
              >
                <RotateCw aria-hidden="true" className="size-4" />
                {isReloading ? 'Reloading…' : 'Reload latest'}
              </Button>
            </>
          ) : (
            <p className="mt-2">What you typed is still in the form.</p>
          )}
        </Notice>
      </div>
    );
  }
  return (
    <FormProblem
      subject={subject}
      fieldErrorCount={fieldErrorCount}
      error={error}
      unplacedMessages={unplacedMessages}
    />
  );
}
