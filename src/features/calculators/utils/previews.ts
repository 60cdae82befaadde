import {
  coreOhmsPerMetre,
  longestRunMetres,
  runLoopOhms,
  voltageAtDetector,
  type CoreBuild,
} from '@server/calc/cable';
import { systemGrade } from '@server/calc/grade';
import { classifyReading, loopBands } from '@server/calc/loop';
import { formatOhms, parseResistance, toRkm } from '@server/calc/notation';
import { MAX_SOUNDER_MINUTES, powerBudget, standbyHours } from '@server/calc/power';
import { colourBands, isPreferred, nearestPreferred } from '@server/calc/preferred-values';
import type { CableQuery, CableResult } from '@/features/calculators/api/calculate-cable';
import type { GradeQuery, GradeResult } from '@/features/calculators/api/calculate-grade';
import type { LoopQuery, LoopResult } from '@/features/calculators/api/calculate-loop';
import type { PowerBudgetQuery } from '@/features/calculators/api/calculate-power-budget';
import type { ResistanceResult } from '@/features/calculators/api/calculate-resistance';
import type { PowerBudgetFigures } from '@/lib/calc-result-schemas';
import { CABLE_CORE_BUILDS, parseReading } from '@/lib/loop-readings';

/*
 * Live previews: the calculators' results worked out in the browser while the figures are typed,
 * with the same calculation module the API runs and in the API's own result shapes, so one
 * display serves both. The API's answer, with its field errors, comes when "Calculate" is pressed.
 * A preview is null while what is typed cannot be worked out yet.
 */

const finite = (value: number) => (Number.isFinite(value) ? value : null);
const isNumber = (value: number | undefined): value is number =>
  typeof value === 'number' && Number.isFinite(value);

function safeColours(ohms: number, count: 4 | 5) {
  try {
    return colourBands(ohms, count).bands;
  } catch {
    return null;
  }
}

export function previewResistance(text: string): ResistanceResult | null {
  const parsed = parseResistance(text);
  if (!parsed.ok || !(parsed.ohms > 0)) return null;
  const ohms = parsed.ohms;
  return {
    ohms,
    code: toRkm(ohms),
    spoken: formatOhms(ohms),
    e12: { nearest: nearestPreferred(ohms, 'E12'), isPreferred: isPreferred(ohms, 'E12') },
    e24: { nearest: nearestPreferred(ohms, 'E24'), isPreferred: isPreferred(ohms, 'E24') },
    fourBands: safeColours(ohms, 4),
    fiveBands: safeColours(ohms, 5),
  };
}

function buildOf(cable: { core?: '7/0.2' | '16/0.2'; areaMm2?: number }): CoreBuild | null {
  if (cable.core) return CABLE_CORE_BUILDS[cable.core];
  return isNumber(cable.areaMm2) && cable.areaMm2 > 0 ? { areaMm2: cable.areaMm2 } : null;
}

function resistor(text: string | undefined): number | null {
  if (text === undefined) return null;
  const parsed = parseResistance(text);
  return parsed.ok && parsed.ohms > 0 ? parsed.ohms : Number.NaN;
}

export function previewLoop(query: LoopQuery): LoopResult | null {
  const tamperOhms = resistor(query.tamperOhms);
  const alarmOhms = resistor(query.alarmOhms);
  if (Number.isNaN(tamperOhms) || Number.isNaN(alarmOhms)) return null;
  let cableOhms = 0;
  if (query.cable) {
    const build = buildOf(query.cable);
    const { runMetres, coresPerLeg = 1, temperatureC = 20 } = query.cable;
    if (!build || !isNumber(runMetres) || runMetres < 0) return null;
    if (!isNumber(coresPerLeg) || coresPerLeg < 1 || !isNumber(temperatureC)) return null;
    cableOhms = runLoopOhms(runMetres, coreOhmsPerMetre(build, temperatureC), coresPerLeg);
  }
  const design = {
    wiring: query.wiring,
    tamperOhms,
    alarmOhms,
    tolerance: query.tolerance,
    cableOhms: { min: cableOhms, max: cableOhms },
  };
  const { bands, problems } = loopBands(design);
  if (bands.length === 0) return null;
  const reading = parseReading(query.reading);
  const classification = reading.status === 'ok' ? classifyReading(design, reading.ohms) : null;
  return {
    cableOhms,
    bands: bands.map((band) => ({
      ...band,
      nominalOhms: finite(band.nominalOhms),
      highOhms: finite(band.highOhms),
    })),
    problems,
    classification: classification && {
      state: classification.state,
      band: classification.band.state,
      marginOhms: finite(classification.marginOhms),
    },
  };
}

export function previewCable(query: CableQuery): CableResult | null {
  const build = buildOf(query);
  const {
    runMetres,
    currentMa,
    coresPerLeg = 1,
    temperatureC = 20,
    supplyVolts = 13.7,
    minimumVolts = 9,
  } = query;
  const numbers = [runMetres, currentMa, coresPerLeg, temperatureC, supplyVolts, minimumVolts];
  if (!build || !numbers.every(isNumber) || runMetres < 0 || currentMa < 0 || coresPerLeg < 1) {
    return null;
  }
  const ohmsPerMetre = coreOhmsPerMetre(build, temperatureC);
  const currentAmps = currentMa / 1000;
  return {
    ohmsPerMetre,
    loopOhms: runLoopOhms(runMetres, ohmsPerMetre, coresPerLeg),
    voltsAtDetector: voltageAtDetector({
      supplyVolts,
      currentAmps,
      runMetres,
      ohmsPerMetre,
      coresPerLeg,
    }),
    longestRunMetres: finite(
      longestRunMetres({ supplyVolts, minimumVolts, currentAmps, ohmsPerMetre, coresPerLeg }),
    ),
  };
}

export type PowerPreview = PowerBudgetFigures | { unavailable: string } | null;

export function previewPowerBudget(query: PowerBudgetQuery): PowerPreview {
  const alarmMinutes = query.alarmMinutes ?? 15;
  if (!isNumber(alarmMinutes) || alarmMinutes <= 0 || alarmMinutes > MAX_SOUNDER_MINUTES) {
    return null;
  }
  const items = query.items.map((item) => ({ ...item, count: item.count ?? 1 }));
  if (
    items.length === 0 ||
    !items.every(
      (item) =>
        isNumber(item.quiescentMa) &&
        isNumber(item.alarmMa) &&
        isNumber(item.count) &&
        item.quiescentMa >= 0 &&
        item.alarmMa >= 0,
    )
  ) {
    return null;
  }
  const lookedUp = standbyHours({
    grade: query.grade,
    psuType: query.psuType,
    mainsFailureSignalled: query.mainsFailureSignalled ?? false,
  });
  const override = query.standbyHoursOverride ?? null;
  if (override !== null && (!isNumber(override) || override <= 0)) return null;
  const hours = override ?? lookedUp.hours;
  if (hours === null) return { unavailable: 'reason' in lookedUp ? lookedUp.reason : '' };
  const batteryAh = query.batteryAh ?? null;
  if (batteryAh !== null && !isNumber(batteryAh)) return null;
  return {
    standbySource: override !== null ? 'entered' : 'source' in lookedUp ? lookedUp.source : '',
    ...powerBudget({ items, standbyHours: hours, alarmMinutes, batteryAh }),
  };
}

export function previewGrade(query: GradeQuery): GradeResult | null {
  if (query.components.length === 0) return null;
  return systemGrade(query.components);
}
