import type { CompletedVisit } from '@server/service/schema';
import { STATE_NAMES } from '@server/calc/loop';
import { Notice } from '@/components/ui/notice';
import { formatCalendarDate } from '@/lib/dates';
import { formatOhms } from '@/lib/loop-readings';

const section = 'grid gap-2 rounded-lg border border-hairline bg-white px-4 py-4';

/** What the API recorded: the outcome, the battery's verdict and each zone's classification. */
export function CompletedVisitSummary({ visit }: { visit: CompletedVisit }) {
  const battery = visit.preventive?.battery ?? null;
  const zones = visit.preventive?.zones ?? [];
  return (
    <div className="grid gap-4" role="status">
      <Notice
        tone={visit.outcome.passed === false ? 'fault' : 'normal'}
        title={`Visit recorded: ${visit.outcome.words}`}
      >
        {visit.outcome.findings.length > 0 ? (
          <ul className="list-disc pl-5">
            {visit.outcome.findings.map((finding) => (
              <li key={finding}>{finding}</li>
            ))}
          </ul>
        ) : null}
        {visit.nextDueOn ? (
          <p>Next preventive visit due {formatCalendarDate(visit.nextDueOn)}.</p>
        ) : null}
        {visit.customerSignedBy ? <p>Signed for by {visit.customerSignedBy}.</p> : null}
      </Notice>
      {battery ? (
        <section aria-labelledby="battery-verdict-heading" className={section}>
          <h2 id="battery-verdict-heading" className="font-semibold">
            Battery: {battery.passed ? 'passed' : 'failed'}
          </h2>
          <p className="font-mono">
            {battery.restingVolts} V at rest, {battery.loadTestVolts} V under load
          </p>
          {[...battery.reasons, ...battery.notes].map((line) => (
            <p key={line} className="text-sm">
              {line}
            </p>
          ))}
        </section>
      ) : null}
      {zones.length > 0 ? (
        <section aria-labelledby="zone-results-heading" className={section}>
          <h2 id="zone-results-heading" className="font-semibold">
            Zones
          </h2>
          <ul className="grid gap-1">
            {zones.map((zone) => (
              <li key={zone.zoneId}>
                <span className="font-mono">{zone.number}</span> {zone.location}:{' '}
                <span className="font-mono">
                  {zone.secureOpen || zone.secureReadingOhms === null
                    ? 'OL'
                    : formatOhms(zone.secureReadingOhms)}
                </span>{' '}
                {zone.secureState ? STATE_NAMES[zone.secureState].toLowerCase() : 'not classified'}{' '}
                — {zone.passed ? 'passed' : `failed: ${zone.failures.join('; ')}`}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
