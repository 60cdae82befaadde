import type { LoopWiring } from '@server/zones/schema';
import { formatOhms } from '@/features/zones/utils/ohms';

export type ExpectedReadings = { normal: string; alarm: string };

const isResistor = (ohms: unknown): ohms is number =>
  typeof ohms === 'number' && Number.isFinite(ohms) && ohms > 0;

/**
 * What a meter across the loop should read, from the resistor values alone. Nominal values only:
 * the bands with tolerance and cable resistance come from the calculation module (server/calc/loop),
 * and the zone editor shows both, so the nominal figure can be checked against the resistors.
 *
 * - Two-resistor loop: the tamper resistor is in series and the alarm resistor sits across the
 *   alarm contact, so the closed contact reads the tamper value and the open one adds the two.
 * - One-resistor loop: the resistor is the whole loop; an alarm opens it.
 * - Closed loop: no resistors; the alarm contact opens the loop.
 *
 * Returns null while the values the wiring needs are missing or unreadable.
 */
export function expectedReadings(
  wiring: LoopWiring | undefined,
  tamperOhms: unknown,
  alarmOhms: unknown,
): ExpectedReadings | null {
  switch (wiring) {
    case 'two_resistor':
      if (!isResistor(tamperOhms) || !isResistor(alarmOhms)) return null;
      return { normal: formatOhms(tamperOhms), alarm: formatOhms(tamperOhms + alarmOhms) };
    case 'one_resistor':
      if (!isResistor(alarmOhms)) return null;
      return { normal: formatOhms(alarmOhms), alarm: 'open circuit' };
    case 'closed_loop_separate_tamper':
      return { normal: 'closed (near 0 Ω)', alarm: 'open circuit' };
    default:
      return null;
  }
}

/** Which resistor values the wiring takes, so the form shows and asks only for those. */
export function resistorsFor(wiring: LoopWiring | undefined): { tamper: boolean; alarm: boolean } {
  // Until the wiring is chosen, both fields show, so nothing seems to be missing.
  return {
    tamper: wiring !== 'one_resistor' && wiring !== 'closed_loop_separate_tamper',
    alarm: wiring !== 'closed_loop_separate_tamper',
  };
}
