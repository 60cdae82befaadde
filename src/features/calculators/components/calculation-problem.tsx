import { ProblemAlert } from '@/components/ui/problem-alert';
import { ApiError } from '@/lib/api-client';

type CalculationProblemProps = {
  error: unknown;
  /** API messages that belong to no field on the form. */
  unplaced: readonly string[];
  /** Field errors are showing beside the fields, from the client's own check or the API. */
  fieldErrorCount: number;
};

/** Why a calculation was refused, announced; the details stay beside each field. */
export function CalculationProblem({ error, unplaced, fieldErrorCount }: CalculationProblemProps) {
  const allBesideFields =
    error instanceof ApiError && error.fieldErrors.length > 0 && unplaced.length === 0;
  if (!error && fieldErrorCount === 0) return null;
  if (!error || allBesideFields) {
    if (fieldErrorCount === 0) return null;
    return (
      <p role="alert" className="text-sm font-semibold text-alarm">
        Not calculated: check the {fieldErrorCount === 1 ? 'field' : `${fieldErrorCount} fields`}{' '}
        marked below.
      </p>
    );
  }
  return (
    <ProblemAlert
      error={error}
      leftoverFieldErrors={unplaced.map((message) => ({ path: '', message }))}
    />
  );
}
