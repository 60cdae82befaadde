import { RotateCw } from 'lucide-react';

import { describeError } from '@/components/errors/describe-error';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { isStaleEdit } from '@/lib/form-errors';

type FormProblemProps = {
  /** What was being saved, as the start of a sentence: "The schedule", "The site". */
  subject: string;
  /** Errors from the client-side check, when the form did not even reach the API. */
  fieldErrorCount: number;
  /** The API's refusal, if the save was sent and refused. */
  error: unknown;
  /** API messages that belong to no single field shown on the form. */
  unplacedMessages?: readonly string[];
  /** Offered when someone else saved first: fetch their version and start again from it. */
  onReloadLatest?: () => void;
  isReloading?: boolean;
};

/**
 * The summary at the top of a form after a failed save. It is an alert, so screen readers
 * announce it; the details stay beside each field.
 */
export function FormProblem({
  subject,
  fieldErrorCount,
  error,
  unplacedMessages = [],
  onReloadLatest,
  isReloading = false,
}: FormProblemProps) {
  if (!error && fieldErrorCount === 0 && unplacedMessages.length === 0) return null;

  if (isStaleEdit(error)) {
    return (
      <div role="alert">
        <Notice tone="fault" title={`${subject} was changed by someone else`}>
          <p>
            Someone saved a newer version while you were editing; what you typed is still here.
            Reload the latest version to see their changes. Reloading replaces what you typed, so
            copy anything you need first.
          </p>
          {onReloadLatest ? (
            <Button
              variant="secondary"
              className="mt-3"
              onClick={onReloadLatest}
              disabled={isReloading}
            >
              <RotateCw aria-hidden="true" className="size-4" />
              {isReloading ? 'Reloading…' : 'Reload latest'}
            </Button>
          ) : null}
        </Notice>
      </div>
    );
  }

  const problemCount = fieldErrorCount + unplacedMessages.length;
  // The API's field errors were shown beside their fields and have all been put right since.
  if (problemCount === 0 && error instanceof ApiError && error.fieldErrors.length > 0) return null;
  const title = `${subject} was not saved`;
  const explanation =
    problemCount > 0
      ? `Check the ${problemCount === 1 ? 'field' : `${problemCount} fields`} marked below.`
      : describeError(error).message;

  return (
    <div role="alert">
      <Notice tone="alarm" title={title}>
        <p>{explanation}</p>
        {unplacedMessages.length > 0 ? (
          <ul className="mt-2 list-disc pl-5">
            {unplacedMessages.map((message) => (
              <li key={message}>{message}</li>
            ))}
          </ul>
        ) : null}
      </Notice>
    </div>
  );
}
