import type { ReactNode } from 'react';
import { CircleCheck, Info, Siren, type LucideIcon } from 'lucide-react';

import type { PowerBudgetFigures } from '@/lib/calc-result-schemas';
import { cn } from '@/utils/cn';

export type { PowerBudgetFigures };

export type PowerBudgetItem = {
  label: string;
  quiescentMa: number;
  alarmMa: number;
  count?: number;
};

const trim = (value: number, places = 3) => Number(value.toFixed(places));

function verdictOf(budget: PowerBudgetFigures): {
  tone: string;
  icon: LucideIcon;
  title: string;
} {
  if (budget.passes === null) {
    return {
      tone: 'border-l-info',
      icon: Info,
      title: `No battery capacity recorded: ${trim(budget.requiredAh, 2)} Ah is needed`,
    };
  }
  return budget.passes
    ? {
        tone: 'border-l-normal',
        icon: CircleCheck,
        title: `Passes: ${budget.batteryAh} Ah fitted, ${trim(budget.requiredAh, 2)} Ah needed`,
      }
    : {
        tone: 'border-l-alarm',
        icon: Siren,
        title: `Fails — battery too small: ${budget.batteryAh} Ah fitted, ${trim(budget.requiredAh, 2)} Ah needed`,
      };
}

const iconColour: Record<string, string> = {
  'border-l-info': 'text-info',
  'border-l-normal': 'text-normal',
  'border-l-alarm': 'text-alarm',
};

function Figure({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-sm text-ink-muted">{term}</dt>
      <dd className="font-mono">{children}</dd>
    </div>
  );
}

function ItemsSummed({
  items,
  budget,
}: {
  items: readonly PowerBudgetItem[];
  budget: PowerBudgetFigures;
}) {
  return (
    <details className="rounded-md border border-hairline">
      <summary className="flex min-h-11 cursor-pointer items-center px-3 text-sm font-semibold">
        Items summed ({items.length})
      </summary>
      <div className="overflow-x-auto border-t border-hairline">
        <table className="w-full text-sm">
          <caption className="sr-only">Currents summed for the power budget</caption>
          <thead className="bg-paper text-left">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">
                Item
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Count
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Quiescent (mA)
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                In alarm (mA)
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-hairline">
            {items.map((item, index) => (
              <tr key={`${item.label}-${index}`}>
                <th scope="row" className="px-3 py-1.5 text-left font-normal">
                  {item.label}
                </th>
                <td className="px-3 py-1.5 text-right font-mono">{item.count ?? 1}</td>
                <td className="px-3 py-1.5 text-right font-mono">{item.quiescentMa}</td>
                <td className="px-3 py-1.5 text-right font-mono">{item.alarmMa}</td>
              </tr>
            ))}
          </tbody>
          <tfoot className="border-t-2 border-ink/30">
            <tr>
              <th scope="row" colSpan={2} className="px-3 py-2 text-left font-semibold">
                Total
              </th>
              <td className="px-3 py-2 text-right font-mono font-semibold">{budget.quiescentMa}</td>
              <td className="px-3 py-2 text-right font-mono font-semibold">{budget.alarmMa}</td>
            </tr>
          </tfoot>
        </table>
      </div>
    </details>
  );
}

type PowerBudgetSummaryProps = {
  budget: PowerBudgetFigures;
  /** What was summed, when known; shown folded so the verdict and the working come first. */
  items?: readonly PowerBudgetItem[];
  className?: string;
};

/**
 * A power budget as a practitioner checks it by hand: the verdict in words and an icon, every
 * figure that went in, and the sum written out with those figures in it.
 */
export function PowerBudgetSummary({ budget, items, className }: PowerBudgetSummaryProps) {
  const verdict = verdictOf(budget);
  const alarmMinutes = Math.round(budget.alarmHours * 60);
  const standbySource =
    budget.standbySource === 'entered' ? 'entered for this calculation' : budget.standbySource;
  return (
    <div className={cn('grid gap-4', className)}>
      <p
        className={cn(
          'flex items-start gap-2 rounded-md border border-l-4 border-hairline bg-white p-3 font-semibold',
          verdict.tone,
        )}
      >
        <verdict.icon
          aria-hidden="true"
          className={cn('mt-0.5 size-5 shrink-0', iconColour[verdict.tone])}
        />
        <span>{verdict.title}</span>
      </p>

      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-3">
        <Figure term="Quiescent current">{budget.quiescentMa} mA</Figure>
        <Figure term="Current in alarm">{budget.alarmMa} mA</Figure>
        <Figure term="Standby time">{budget.standbyHours} h</Figure>
        <Figure term="Alarm time">
          {alarmMinutes} min ({trim(budget.alarmHours, 4)} h)
        </Figure>
        <Figure term="Ageing factor">× {budget.ageingFactor}</Figure>
        <Figure term="Standby / alarm">
          {trim(budget.standbyAh)} Ah + {trim(budget.alarmAh)} Ah
        </Figure>
        <Figure term="Required">{trim(budget.requiredAh, 2)} Ah</Figure>
        <Figure term="Fitted">
          {budget.batteryAh === null ? 'not recorded' : `${budget.batteryAh} Ah`}
        </Figure>
      </dl>
      <p className="text-sm text-ink-muted">
        Standby time from: <span className="text-ink">{standbySource}</span>.
      </p>

      <div>
        <p className="text-sm font-semibold">Working</p>
        <p className="text-sm text-ink-muted">
          (quiescent current × standby time + current in alarm × alarm time) × ageing factor
        </p>
        <p className="mt-1 rounded-md bg-paper px-3 py-2 font-mono text-sm break-words">
          {budget.working}
        </p>
      </div>

      {items ? <ItemsSummed items={items} budget={budget} /> : null}
    </div>
  );
}
