import type { Keyholding } from '@server/my/schema';
import { Clock, DoorOpen, KeyRound, ListOrdered, RadioTower, TriangleAlert } from 'lucide-react';
import { useId } from 'react';

import { PostalAddress } from '@/components/ui/postal-address';
import { TelLink } from '@/components/ui/tel-link';

/**
 * One site a keyholder holds keys for: how to get in, what to watch out for, and their place in
 * the call plan. Nothing else of the site is shown, by design.
 */
export function KeyholdingCard({ keyholding }: { keyholding: Keyholding }) {
  const headingId = useId();
  const hazardsId = useId();
  const accessId = useId();
  const centreId = useId();
  return (
    <article
      aria-labelledby={headingId}
      className="overflow-hidden rounded-lg border border-hairline bg-white"
    >
      <div className="flex items-center gap-2 border-b border-hairline px-4 py-3">
        <KeyRound aria-hidden="true" className="size-5 shrink-0" />
        <h2 id={headingId} className="text-lg font-semibold">
          {keyholding.siteName}
        </h2>
      </div>
      <div className="grid gap-5 px-4 py-4">
        <PostalAddress address={keyholding.address} />

        {keyholding.hazards.trim() ? (
          <section
            aria-labelledby={hazardsId}
            className="rounded-md border-2 border-ink bg-paper p-4"
          >
            <h3 id={hazardsId} className="flex items-center gap-2 text-lg font-semibold">
              <TriangleAlert aria-hidden="true" className="size-6 shrink-0" />
              Hazards at this site
            </h3>
            <p className="mt-2 text-base whitespace-pre-wrap">{keyholding.hazards}</p>
          </section>
        ) : null}

        <ul className="grid gap-3 text-base">
          <li className="flex gap-3">
            <ListOrdered aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
            <span>
              You are number <span className="font-mono font-semibold">{keyholding.callOrder}</span>{' '}
              of <span className="font-mono font-semibold">{keyholding.keyholderCount}</span> in the
              call order.
            </span>
          </li>
          <li className="flex gap-3">
            <Clock aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
            <span>
              You said you can be there in{' '}
              <span className="font-mono font-semibold">{keyholding.minutesToAttend}</span>{' '}
              {keyholding.minutesToAttend === 1 ? 'minute' : 'minutes'}.
            </span>
          </li>
        </ul>

        <section aria-labelledby={accessId} className="grid gap-1">
          <h3 id={accessId} className="flex items-center gap-2 font-semibold">
            <DoorOpen aria-hidden="true" className="size-5 shrink-0" />
            Access notes
          </h3>
          <p className="whitespace-pre-wrap">
            {keyholding.accessNotes.trim() || 'The homeowner has not added access notes.'}
          </p>
        </section>

        {keyholding.monitoringCentre ? (
          <section aria-labelledby={centreId} className="grid gap-1">
            <h3 id={centreId} className="flex items-center gap-2 font-semibold">
              <RadioTower aria-hidden="true" className="size-5 shrink-0" />
              Monitoring centre
            </h3>
            <p>{keyholding.monitoringCentre.name}</p>
            {keyholding.monitoringCentre.phone ? (
              <TelLink
                phone={keyholding.monitoringCentre.phone}
                large
                accessiblePrefix={`Call ${keyholding.monitoringCentre.name} on`}
              />
            ) : null}
          </section>
        ) : null}
      </div>
    </article>
  );
}
