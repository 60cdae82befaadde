import type { ReactNode } from 'react';
import { BatteryCharging, Cable, CircleDot, Medal, Waypoints, type LucideIcon } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { PageHeading } from '@/components/ui/page-heading';
import { CableCalculator } from '@/features/calculators/components/cable-calculator';
import { GradeCalculator } from '@/features/calculators/components/grade-calculator';
import { LoopCalculator } from '@/features/calculators/components/loop-calculator';
import { PowerBudgetCalculator } from '@/features/calculators/components/power-budget-calculator';
import { ResistorCalculator } from '@/features/calculators/components/resistor-calculator';

type Section = {
  id: string;
  title: string;
  icon: LucideIcon;
  intro: string;
  calculator: ReactNode;
};

const SECTIONS: Section[] = [
  {
    id: 'resistor',
    title: 'Resistor value',
    icon: CircleDot,
    intro:
      'Type a value any way it is written: its ohms, resistor code and spoken form, the nearest E12 and E24 preferred values, and its colour bands.',
    calculator: <ResistorCalculator />,
  },
  {
    id: 'loop',
    title: 'Loop check',
    icon: Waypoints,
    intro:
      'The bands a panel sees on a zone, for its wiring, resistors, tolerance and cable, and what a meter reading means on it.',
    calculator: <LoopCalculator />,
  },
  {
    id: 'cable',
    title: 'Cable',
    icon: Cable,
    intro:
      'The resistance of a copper run, the voltage left at the detector at the end of it, and the longest run that still powers it.',
    calculator: <CableCalculator />,
  },
  {
    id: 'power',
    title: 'Power budget',
    icon: BatteryCharging,
    intro:
      'The standby battery a list of powered items needs, by grade and power supply type, and whether the fitted battery is enough.',
    calculator: <PowerBudgetCalculator />,
  },
  {
    id: 'grade',
    title: 'Grade',
    icon: Medal,
    intro: 'A system’s grade from its parts’ grades, and which parts set it.',
    calculator: <GradeCalculator />,
  },
];

/** The calculations behind Wardbook's checks, on figures typed in, each with its working. */
export function Component() {
  return (
    <>
      <title>Calculators · Wardbook</title>
      <PageHeading title="Calculators">
        <p>
          The same calculations Wardbook uses for zone schedules, power budgets and handover packs.
          Each result shows its working so it can be checked by hand.
        </p>
      </PageHeading>
      <nav aria-label="Calculators on this page" className="mb-6">
        <ul className="flex flex-wrap gap-2">
          {SECTIONS.map((section) => (
            <li key={section.id}>
              <a
                href={`#${section.id}`}
                className="inline-flex min-h-10 items-center rounded-md border border-hairline bg-white px-3 text-sm font-medium no-underline hover:bg-paper-deep"
              >
                {section.title}
              </a>
            </li>
          ))}
        </ul>
      </nav>
      <div className="grid gap-8">
        {SECTIONS.map((section) => (
          <div key={section.id} id={section.id} className="scroll-mt-4">
            <Card title={section.title} icon={section.icon}>
              <p className="mb-4 max-w-prose text-sm text-ink-muted">{section.intro}</p>
              {section.calculator}
            </Card>
          </div>
        ))}
      </div>
    </>
  );
}
