/**
 * Copper alarm cable to IEC 60028: annealed copper has a resistivity of 1/58 Ω·mm²/m at 20 °C
 * and a temperature coefficient of 0.00393 per kelvin.
 */
export const COPPER_RESISTIVITY = 1 / 58; // Ω·mm²/m at 20 °C (IEC 60028)
export const COPPER_TEMPERATURE_COEFFICIENT = 0.00393; // per K at 20 °C (IEC 60028)

export type CoreBuild = { strands: number; strandDiameterMm: number } | { areaMm2: number };

/** Cross-section of a core: 7/0.2 (seven 0.2 mm strands) is 7 × π × 0.1² = 0.2199 mm². */
export function coreAreaMm2(build: CoreBuild): number {
  if ('areaMm2' in build) return build.areaMm2;
  return build.strands * Math.PI * (build.strandDiameterMm / 2) ** 2;
}

/** Resistance of one metre of one core at a temperature (7/0.2 at 20 °C: 0.0784 Ω/m). */
export function coreOhmsPerMetre(build: CoreBuild, temperatureC = 20): number {
  return (
    (COPPER_RESISTIVITY / coreAreaMm2(build)) *
    (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperatureC - 20))
  );
}

/**
 * A run's loop resistance: out on one leg and back on the other, so twice the length; cores
 * doubled up on a leg are in parallel, dividing that leg's resistance.
 */
export function runLoopOhms(runMetres: number, ohmsPerMetre: number, coresPerLeg = 1): number {
  return (2 * runMetres * ohmsPerMetre) / coresPerLeg;
}

/** Supply volts less the drop along the run for the detector's current. */
export function voltageAtDetector(options: {
  supplyVolts: number;
  currentAmps: number;
  runMetres: number;
  ohmsPerMetre: number;
  coresPerLeg?: number;
}): number {
  return (
    options.supplyVolts -
    options.currentAmps * runLoopOhms(options.runMetres, options.ohmsPerMetre, options.coresPerLeg)
  );
}

/** The longest run that still leaves the detector its minimum working voltage. */
export function longestRunMetres(options: {
  supplyVolts: number;
  minimumVolts: number;
  currentAmps: number;
  ohmsPerMetre: number;
  coresPerLeg?: number;
}): number {
  const headroom = options.supplyVolts - options.minimumVolts;
  if (headroom <= 0) return 0;
  if (options.currentAmps <= 0) return Number.POSITIVE_INFINITY;
  return (headroom * (options.coresPerLeg ?? 1)) / (2 * options.currentAmps * options.ohmsPerMetre);
}

/** The usual alarm cable: 7/0.2 mm stranded cores. */
export const SEVEN_STRAND_0_2: CoreBuild = { strands: 7, strandDiameterMm: 0.2 };
