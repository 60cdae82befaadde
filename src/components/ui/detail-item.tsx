import type { ReactNode } from 'react';

/** One term and its value in a record's description list (`<dl>`), the value free to wrap. */
export function DetailItem({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-sm text-ink-muted">{term}</dt>
      <dd className="break-words">{children}</dd>
    </div>
  );
}
