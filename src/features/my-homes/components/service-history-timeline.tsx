import { CircleCheck, FileText, TriangleAlert, Wrench } from 'lucide-react';

import type { ServiceHistoryEntry } from '@server/service-history/schema';
import { formatDateTime } from '@/utils/format';

const PACK_STATUS_WORDS: Record<'valid' | 'superseded' | 'revoked', string> = {
  valid: 'current',
  superseded: 'replaced by a later revision',
  revoked: 'withdrawn',
};

function EntryIcon({ entry }: { entry: ServiceHistoryEntry }) {
  const className = 'mt-1 size-5 shrink-0';
  if (entry.kind === 'handover_pack')
    return <FileText aria-hidden="true" className={`${className} text-info`} />;
  if (entry.kind === 'fault_report')
    return <TriangleAlert aria-hidden="true" className={`${className} text-fault`} />;
  if (entry.passed === false)
    return <TriangleAlert aria-hidden="true" className={`${className} text-fault`} />;
  if (entry.passed === true)
    return <CircleCheck aria-hidden="true" className={`${className} text-normal`} />;
  return <Wrench aria-hidden="true" className={`${className} text-ink`} />;
}

function EntryBody({ entry }: { entry: ServiceHistoryEntry }) {
  switch (entry.kind) {
    case 'visit':
      return (
        <>
          <p>
            <span className="font-medium">Outcome:</span> {entry.outcome}
          </p>
          {entry.findings.length > 0 ? (
            <ul className="list-disc pl-5 text-sm">
              {entry.findings.map((finding) => (
                <li key={finding}>{finding}</li>
              ))}
            </ul>
          ) : null}
          {entry.engineerName ? (
            <p className="text-sm text-ink-muted">Engineer: {entry.engineerName}</p>
          ) : null}
          {entry.reportUrl ? (
            <p>
              <a href={entry.reportUrl} className="font-medium underline">
                Download the service report
              </a>
            </p>
          ) : null}
        </>
      );
    case 'fault_report':
      return (
        <>
          <p className="whitespace-pre-line">{entry.description}</p>
          <p className="text-sm">
            <span className="font-medium">Where it is:</span> {entry.statusWords}
            {entry.photoCount > 0
              ? ` · ${entry.photoCount === 1 ? '1 photo' : `${entry.photoCount} photos`}`
              : ''}
          </p>
        </>
      );
    case 'handover_pack':
      return (
        <p>
          <span className="font-mono">{entry.packNumber}</span>, revision {entry.revision} (
          {PACK_STATUS_WORDS[entry.status]}).{' '}
          <a href={entry.downloadUrl} className="font-medium underline">
            Download the pack<span className="sr-only"> {entry.packNumber}</span>
          </a>
        </p>
      );
  }
}

/** Everything that has happened to the home's system, newest first, as one list. */
export function ServiceHistoryTimeline({ entries }: { entries: readonly ServiceHistoryEntry[] }) {
  if (entries.length === 0)
    return (
      <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
        Nothing yet: visits, fault reports and handover packs will be listed here.
      </p>
    );
  return (
    <ol aria-label="Service history, newest first" className="grid gap-3">
      {entries.map((entry) => (
        <li
          key={`${entry.kind}:${entry.id}`}
          className="flex gap-3 rounded-lg border border-hairline bg-white px-4 py-3"
        >
          <EntryIcon entry={entry} />
          <div className="grid min-w-0 gap-1">
            <p className="text-sm text-ink-muted">
              <time dateTime={entry.at}>{formatDateTime(entry.at)}</time>
            </p>
            <h3 className="font-semibold">{entry.title}</h3>
            <EntryBody entry={entry} />
          </div>
        </li>
      ))}
    </ol>
  );
}
