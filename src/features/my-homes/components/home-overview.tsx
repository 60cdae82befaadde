import type { MyHome } from '@server/my/schema';
import { ChevronRight, ShieldCheck } from 'lucide-react';
import { Link } from 'react-router-dom';

import { Card } from '@/components/ui/card';
import { paths, type MyHomeSection } from '@/config/paths';
import { PoliceResponse } from '@/features/my-homes/components/police-response';
import { WhoToCallCard } from '@/features/my-homes/components/who-to-call-card';
import { ENVIRONMENTAL_CLASS_SUMMARIES, GRADE_SUMMARIES, romanClass } from '@/lib/en50131';

function plural(count: number, one: string, many: string): string {
  return `${count} ${count === 1 ? one : many}`;
}

/** The homeowner's first view of one home: who to call, how it is protected, what is recorded. */
export function HomeOverview({ home }: { home: MyHome }) {
  const recorded: Array<{ section: MyHomeSection; text: string }> = [
    { section: 'zones', text: plural(home.counts.zones, 'zone', 'zones') },
    { section: 'keyholders', text: plural(home.counts.keyholders, 'keyholder', 'keyholders') },
    {
      section: 'user-codes',
      text: plural(home.counts.userSlots, 'user-code slot', 'user-code slots'),
    },
    {
      section: 'files',
      text: plural(home.counts.files, 'photo or document', 'photos and documents'),
    },
  ];

  return (
    <div className="grid gap-5">
      <WhoToCallCard home={home} />
      <Card title="Your system" icon={ShieldCheck}>
        <div className="grid gap-4">
          <dl className="grid gap-3">
            <div>
              <dt className="text-sm text-ink-muted">Security grade (EN 50131)</dt>
              <dd>
                <span className="font-semibold">Grade {home.requiredGrade}</span>
                {GRADE_SUMMARIES[home.requiredGrade]
                  ? `. ${GRADE_SUMMARIES[home.requiredGrade]}`
                  : null}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-muted">Environmental class</dt>
              <dd>
                <span className="font-semibold">Class {romanClass(home.environmentalClass)}</span>
                {ENVIRONMENTAL_CLASS_SUMMARIES[home.environmentalClass]
                  ? `. ${ENVIRONMENTAL_CLASS_SUMMARIES[home.environmentalClass]}.`
                  : null}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-muted">Site reference</dt>
              <dd className="font-mono">{home.reference}</dd>
            </div>
          </dl>
          <PoliceResponse home={home} />
          <ul className="grid gap-2">
            {recorded.map(({ section, text }) => (
              <li key={section}>
                <Link
                  to={paths.myHome.getHref(home.id, section)}
                  className="flex min-h-12 items-center justify-between rounded-md border border-hairline px-3 font-medium"
                >
                  {text}
                  <ChevronRight aria-hidden="true" className="size-5 shrink-0" />
                </Link>
              </li>
            ))}
          </ul>
        </div>
      </Card>
    </div>
  );
}
