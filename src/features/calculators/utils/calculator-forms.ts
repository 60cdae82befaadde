import type { LoopWiring } from '@server/zones/schema';
import type { PsuType } from '@server/calc/power';
import type { CableQuery } from '@/features/calculators/api/calculate-cable';
import type { GradeQuery } from '@/features/calculators/api/calculate-grade';
import type { LoopQuery } from '@/features/calculators/api/calculate-loop';
import type { PowerBudgetQuery } from '@/features/calculators/api/calculate-power-budget';
import type { CableCore } from '@/lib/loop-readings';

/*
 * The calculators' forms hold what was typed, as text; these turn it into the API's request
 * bodies. Field names follow the bodies, so the API's field errors land beside their fields.
 */

/** Empty is "not given" (the API's default applies); anything else is read as a number. */
export function optionalNumber(text: string | undefined): number | undefined {
  if (text === undefined || text.trim() === '') return undefined;
  return Number(text);
}

const optionalText = (text: string) => (text.trim() === '' ? undefined : text.trim());

/** The core build, or "area" when the core is given by its cross-section instead. */
export type CoreChoice = CableCore | 'area';

export type CableFields = {
  core: CoreChoice;
  areaMm2: string;
  runMetres: string;
  coresPerLeg: string;
  temperatureC: string;
};

function cableBuild(cable: Pick<CableFields, 'core' | 'areaMm2'>) {
  return cable.core === 'area' ? { areaMm2: optionalNumber(cable.areaMm2) } : { core: cable.core };
}

export type LoopFormValues = {
  wiring: LoopWiring;
  tamperOhms: string;
  alarmOhms: string;
  tolerance: string;
  cable: CableFields;
  reading: string;
};

export const LOOP_FORM_START: LoopFormValues = {
  wiring: 'two_resistor',
  tamperOhms: '2K2',
  alarmOhms: '4K7',
  tolerance: '0.05',
  cable: { core: '7/0.2', areaMm2: '', runMetres: '', coresPerLeg: '1', temperatureC: '20' },
  reading: '',
};

export function toLoopQuery(values: LoopFormValues): LoopQuery {
  const { wiring, cable } = values;
  const runMetres = optionalNumber(cable.runMetres);
  return {
    wiring,
    // Only the resistors the wiring has, so a value left in a hidden field is not sent.
    tamperOhms: wiring === 'two_resistor' ? optionalText(values.tamperOhms) : undefined,
    alarmOhms:
      wiring === 'closed_loop_separate_tamper' ? undefined : optionalText(values.alarmOhms),
    tolerance: Number(values.tolerance),
    cable:
      runMetres === undefined
        ? null
        : {
            ...cableBuild(cable),
            runMetres,
            coresPerLeg: optionalNumber(cable.coresPerLeg),
            temperatureC: optionalNumber(cable.temperatureC),
          },
    reading: optionalText(values.reading) ?? null,
  };
}

export type CableFormValues = CableFields & {
  currentMa: string;
  supplyVolts: string;
  minimumVolts: string;
};

export const CABLE_FORM_START: CableFormValues = {
  core: '7/0.2',
  areaMm2: '',
  runMetres: '100',
  coresPerLeg: '1',
  temperatureC: '20',
  currentMa: '25',
  supplyVolts: '13.7',
  minimumVolts: '9',
};

export function toCableQuery(values: CableFormValues): CableQuery {
  return {
    ...cableBuild(values),
    runMetres: optionalNumber(values.runMetres) as number,
    coresPerLeg: optionalNumber(values.coresPerLeg),
    temperatureC: optionalNumber(values.temperatureC),
    supplyVolts: optionalNumber(values.supplyVolts),
    currentMa: optionalNumber(values.currentMa) as number,
    minimumVolts: optionalNumber(values.minimumVolts),
  };
}

export type PowerItemFields = {
  label: string;
  quiescentMa: string;
  alarmMa: string;
  count: string;
};

export type PowerFormValues = {
  items: PowerItemFields[];
  grade: string;
  psuType: PsuType;
  mainsFailureSignalled: boolean;
  standbyHoursOverride: string;
  alarmMinutes: string;
  batteryAh: string;
};

export const NEW_POWER_ITEM: PowerItemFields = {
  label: '',
  quiescentMa: '',
  alarmMa: '',
  count: '1',
};

export const POWER_FORM_START: PowerFormValues = {
  items: [
    { label: 'Control panel', quiescentMa: '', alarmMa: '', count: '1' },
    { label: 'PIR detectors', quiescentMa: '', alarmMa: '', count: '1' },
  ],
  grade: '2',
  psuType: 'A',
  mainsFailureSignalled: false,
  standbyHoursOverride: '',
  alarmMinutes: '15',
  batteryAh: '',
};

export function toPowerQuery(values: PowerFormValues): PowerBudgetQuery {
  return {
    items: values.items.map((item) => ({
      label: item.label.trim(),
      quiescentMa: optionalNumber(item.quiescentMa) as number,
      alarmMa: optionalNumber(item.alarmMa) as number,
      count: optionalNumber(item.count),
    })),
    grade: Number(values.grade),
    psuType: values.psuType,
    mainsFailureSignalled: values.mainsFailureSignalled,
    standbyHoursOverride: optionalNumber(values.standbyHoursOverride) ?? null,
    alarmMinutes: optionalNumber(values.alarmMinutes),
    batteryAh: optionalNumber(values.batteryAh) ?? null,
  };
}

export type GradeComponentFields = { label: string; grade: string };
export type GradeFormValues = { components: GradeComponentFields[] };

export const GRADE_FORM_START: GradeFormValues = {
  components: [
    { label: 'Control panel', grade: '3' },
    { label: 'Keypad (hall)', grade: '2' },
    { label: 'Detector (lounge)', grade: '3' },
  ],
};

export function toGradeQuery(values: GradeFormValues): GradeQuery {
  return {
    components: values.components.map((component) => ({
      label: component.label.trim(),
      grade: component.grade === '' ? null : Number(component.grade),
    })),
  };
}
