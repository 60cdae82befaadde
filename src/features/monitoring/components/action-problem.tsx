import { ProblemAlert } from '@/components/ui/problem-alert';
import { ApiError } from '@/lib/api-client';

type ActionProblemProps = {
  /** What did not happen, as a sentence: "The event was not taken." */
  title: string;
  error: unknown;
  /** Fields whose errors are already shown beside them, as the request names them. */
  shownFields?: readonly string[];
};

/**
 * Why an action on an event failed, beside the action: the API's own reason (who has the event,
 * why police cannot be asked) under a sentence saying what did not happen.
 */
export function ActionProblem({ title, error, shownFields = [] }: ActionProblemProps) {
  const fieldErrors = error instanceof ApiError ? error.fieldErrors : [];
  const leftover = fieldErrors.filter(
    (fieldError) => !shownFields.includes(fieldError.path.replace(/^body\./, '')),
  );
  return (
    <ProblemAlert
      error={error}
      title={title}
      leftoverFieldErrors={leftover}
      hint={leftover.length < fieldErrors.length ? 'Check the fields marked above.' : undefined}
      className="p-3"
    />
  );
}
