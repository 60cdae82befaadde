export type TestStatus = 'not-tested' | 'passed' | 'failed' | 'on-phone' | 'refused';

/** The status of a test from its last saved result and what is waiting on the phone. */
export function statusOf(
  saved: { passed: boolean } | null,
  onPhone: { refusal?: string }[],
): TestStatus {
  if (onPhone.some((entry) => entry.refusal)) return 'refused';
  if (onPhone.length > 0) return 'on-phone';
  if (!saved) return 'not-tested';
  return saved.passed ? 'passed' : 'failed';
}
