import { TriangleAlert } from 'lucide-react';

import { coreOhmsPerMetre } from '@server/calc/cable';
import { OPEN_FLOOR_OHMS, SHORT_ALLOWANCE_OHMS, STATE_NAMES } from '@server/calc/loop';
import { LoopGauge, LoopStateBadge } from '@/components/ui/loop-gauge';
import type { LoopQuery, LoopResult } from '@/features/calculators/api/calculate-loop';
import { Working } from '@/features/calculators/components/calculator-fields';
import {
  CABLE_CORE_BUILDS,
  describeMargin,
  formatOhms,
  formatOhmsRange,
  parseReading,
  toGaugeBands,
  toGaugeState,
} from '@/lib/loop-readings';

const figure = (value: number, places = 1) => String(Number(value.toFixed(places)));

function cableWorking(query: LoopQuery, cableOhms: number): string {
  if (!query.cable) return 'Cable: none given, so 0 Ω is added to every band.';
  const { core, areaMm2, runMetres, coresPerLeg = 1, temperatureC = 20 } = query.cable;
  const build = core ? CABLE_CORE_BUILDS[core] : { areaMm2: areaMm2 ?? 0 };
  const perMetre = coreOhmsPerMetre(build, temperatureC);
  return (
    `Cable: 2 × ${runMetres} m × ${figure(perMetre, 4)} Ω/m ÷ ${coresPerLeg} ` +
    `${coresPerLeg === 1 ? 'core' : 'cores'} per leg = ${figure(cableOhms)} Ω (${core ?? `${areaMm2} mm²`} at ${temperatureC} °C)`
  );
}

function bandWorking(result: LoopResult, tolerance: number): string[] {
  const cable = result.cableOhms;
  return result.bands.map((band) => {
    const name = STATE_NAMES[band.state];
    if (band.highOhms === null) {
      return `${name}: from the larger of ${formatOhms(OPEN_FLOOR_OHMS)} and twice the highest edge below = ${formatOhms(band.lowOhms)}`;
    }
    if (band.lowOhms === 0) {
      return `${name}: 0 to cable ${figure(cable)} Ω + ${SHORT_ALLOWANCE_OHMS} Ω allowance = ${figure(band.highOhms)} Ω`;
    }
    const resistor = (band.nominalOhms ?? 0) - cable;
    return (
      `${name}: ${figure(resistor)} Ω × (1 − ${tolerance}) + ${figure(cable)} Ω = ${figure(band.lowOhms)} Ω ` +
      `to ${figure(resistor)} Ω × (1 + ${tolerance}) + ${figure(cable)} Ω = ${figure(band.highOhms)} Ω`
    );
  });
}

/** A loop's bands on the gauge and in a table, any design problem, and what the reading means. */
export function LoopResultView({ query, result }: { query: LoopQuery; result: LoopResult }) {
  const reading = parseReading(query.reading);
  const readingOhms = reading.status === 'ok' ? reading.ohms : null;
  const { classification } = result;

  return (
    <div className="grid gap-4">
      <LoopGauge
        bands={toGaugeBands(result.bands)}
        readingOhms={readingOhms}
        className="max-w-2xl"
      />
      {classification && readingOhms !== null ? (
        <p className="flex flex-wrap items-center gap-x-2 gap-y-1 rounded-md border border-hairline bg-white p-3">
          <span>
            Reading <span className="font-mono font-semibold">{formatOhms(readingOhms)}</span>:
          </span>
          <LoopStateBadge state={toGaugeState(classification.state)} />
          {classification.marginOhms !== null ? (
            <span className="text-sm">
              —{' '}
              {describeMargin(classification.state, classification.band, classification.marginOhms)}
            </span>
          ) : null}
        </p>
      ) : null}
      {result.problems.map((problem) => (
        <p
          key={problem}
          role="note"
          className="flex items-start gap-2 rounded-md border border-l-4 border-hairline border-l-alarm bg-white p-3 text-sm"
        >
          <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-alarm" />
          <span>
            <span className="font-semibold">Design problem: </span>
            {problem}
          </span>
        </p>
      ))}
      <div className="overflow-x-auto">
        <table className="w-full max-w-2xl text-sm">
          <caption className="sr-only">Bands for this loop</caption>
          <thead className="bg-paper text-left">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">
                State
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Band
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Nominal
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-hairline">
            {result.bands.map((band) => (
              <tr key={band.state}>
                <th scope="row" className="px-3 py-1.5 text-left font-medium">
                  {STATE_NAMES[band.state]}
                </th>
                <td className="px-3 py-1.5 font-mono">
                  {formatOhmsRange(band.lowOhms, band.highOhms)}
                </td>
                <td className="px-3 py-1.5 font-mono">
                  {band.nominalOhms === null ? '—' : formatOhms(band.nominalOhms)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <Working
        lines={[cableWorking(query, result.cableOhms), ...bandWorking(result, query.tolerance)]}
      />
    </div>
  );
}
