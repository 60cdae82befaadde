import type { ReactNode } from 'react';
import {
  BatteryCharging,
  CircleCheck,
  Info,
  Medal,
  Siren,
  ThermometerSun,
  TriangleAlert,
  type LucideIcon,
} from 'lucide-react';

import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { PowerBudgetSummary, type PowerBudgetItem } from '@/components/ui/power-budget-summary';
import type { SiteEngineering } from '@/features/engineering/api/get-site-engineering';
import { romanClass } from '@/lib/en50131';
import { cn } from '@/utils/cn';

type Tone = 'normal' | 'alarm' | 'info';

const toneStyles: Record<Tone, { border: string; icon: string }> = {
  normal: { border: 'border-l-normal', icon: 'text-normal' },
  alarm: { border: 'border-l-alarm', icon: 'text-alarm' },
  info: { border: 'border-l-info', icon: 'text-info' },
};

/** A verdict in words with its icon; the colour only repeats what they say. */
function Verdict({
  tone,
  icon: Icon,
  children,
}: {
  tone: Tone;
  icon: LucideIcon;
  children: ReactNode;
}) {
  return (
    <p
      className={cn(
        'flex items-start gap-2 rounded-md border border-l-4 border-hairline bg-white p-3 font-semibold',
        toneStyles[tone].border,
      )}
    >
      <Icon aria-hidden="true" className={cn('mt-0.5 size-5 shrink-0', toneStyles[tone].icon)} />
      <span>{children}</span>
    </p>
  );
}

/** A long list of names folded away behind a count, so forty zones do not swamp the card. */
function NameList({ summary, names }: { summary: string; names: readonly string[] }) {
  if (names.length === 0) return null;
  if (names.length <= 3) {
    return (
      <p className="text-sm">
        {summary}: {names.join(', ')}.
      </p>
    );
  }
  return (
    <details className="rounded-md border border-hairline">
      <summary className="flex min-h-11 cursor-pointer items-center px-3 text-sm font-semibold">
        {summary} ({names.length})
      </summary>
      <ul className="grid gap-1 border-t border-hairline px-3 py-2 text-sm">
        {names.map((name) => (
          <li key={name}>{name}</li>
        ))}
      </ul>
    </details>
  );
}

export function SystemGradeCard({ engineering }: { engineering: SiteEngineering }) {
  const { grade, requiredGrade } = engineering;
  return (
    <Card title="System grade" icon={Medal} headingLevel={3}>
      <div className="grid gap-3">
        {grade.grade === null ? (
          <Verdict tone="info" icon={Info}>
            No grade recorded on any part yet; the site needs grade {requiredGrade}.
          </Verdict>
        ) : grade.grade >= requiredGrade ? (
          <Verdict tone="normal" icon={CircleCheck}>
            Grade {grade.grade}: meets the site&rsquo;s required grade {requiredGrade}
          </Verdict>
        ) : (
          <Verdict tone="alarm" icon={Siren}>
            Grade {grade.grade}: below the site&rsquo;s required grade {requiredGrade}
          </Verdict>
        )}
        <p className="text-sm text-ink-muted">
          A system&rsquo;s grade is the lowest grade of its parts (EN 50131-1): the panel, every
          zone&rsquo;s detector and every device.
        </p>
        <NameList summary={`Set by grade ${grade.grade ?? ''} parts`} names={grade.limitedBy} />
        {grade.ungraded.length > 0 ? (
          <NameList
            summary="No grade recorded, so the system grade is not confirmed"
            names={grade.ungraded}
          />
        ) : null}
      </div>
    </Card>
  );
}

export function EnvironmentalClassCard({ engineering }: { engineering: SiteEngineering }) {
  const mismatches = engineering.environmentalMismatches;
  return (
    <Card title="Environmental classes" icon={ThermometerSun} headingLevel={3}>
      <div className="grid gap-3">
        {mismatches.length === 0 ? (
          <Verdict tone="normal" icon={CircleCheck}>
            No mismatches: every part with a class recorded suits where it is fitted
          </Verdict>
        ) : (
          <>
            <Verdict tone="alarm" icon={TriangleAlert}>
              {mismatches.length === 1
                ? '1 part is not rated for where it is fitted'
                : `${mismatches.length} parts are not rated for where they are fitted`}
            </Verdict>
            <ul className="grid gap-2 text-sm">
              {mismatches.map((mismatch) => (
                <li key={mismatch.label}>
                  <span className="font-semibold">{mismatch.label}</span> is class{' '}
                  <span className="font-mono">{romanClass(mismatch.environmentalClass)}</span>; its
                  location ({mismatch.why}) needs class{' '}
                  <span className="font-mono">{romanClass(mismatch.required)}</span>.
                </li>
              ))}
            </ul>
          </>
        )}
        <p className="text-sm text-ink-muted">
          Outdoor and unheated places are read from each location&rsquo;s words
          (&ldquo;garage&rdquo;, &ldquo;outside&rdquo;); anywhere else needs the site&rsquo;s own
          class. Parts without a class recorded are not checked.
        </p>
      </div>
    </Card>
  );
}

export function PowerBudgetCard({
  engineering,
  items,
}: {
  engineering: SiteEngineering;
  items?: readonly PowerBudgetItem[];
}) {
  const { power } = engineering;
  return (
    <Card title="Power budget" icon={BatteryCharging} headingLevel={3}>
      {power.available ? (
        <PowerBudgetSummary budget={power} items={items} />
      ) : (
        <Notice tone="info" title="No power budget yet">
          <p>{power.reason}</p>
        </Notice>
      )}
    </Card>
  );
}

type SystemEngineeringProps = {
  engineering: SiteEngineering | null;
  powerItems?: readonly PowerBudgetItem[];
};

/** The saved system checked by the calculations: battery, grade and environmental classes. */
export function SystemEngineering({ engineering, powerItems }: SystemEngineeringProps) {
  if (!engineering) {
    return (
      <Notice tone="info" title="Nothing to check yet">
        <p>Save the system to see its power budget, grade and environmental classes.</p>
      </Notice>
    );
  }
  return (
    <div className="grid gap-6">
      <PowerBudgetCard engineering={engineering} items={powerItems} />
      <div className="grid gap-6 lg:grid-cols-2">
        <SystemGradeCard engineering={engineering} />
        <EnvironmentalClassCard engineering={engineering} />
      </div>
    </div>
  );
}
