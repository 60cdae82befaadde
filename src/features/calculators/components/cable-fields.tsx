import { useFormContext, useWatch } from 'react-hook-form';

import { CABLE_CORES } from '@server/systems/schema';
import { NumberInput, SelectInput } from '@/features/calculators/components/calculator-fields';

type CableFieldsProps = {
  /** Where the cable's fields sit in the form: "" at the top, "cable." inside the loop's body. */
  prefix: '' | 'cable.';
  /** The loop calculator may leave the run empty: no cable counted. */
  runOptional?: boolean;
};

/** The cable run: core build (or area), length, cores doubled up per leg, temperature. */
export function CableFields({ prefix, runOptional = false }: CableFieldsProps) {
  const { control } = useFormContext();
  const core = useWatch({ control, name: `${prefix}core` }) as string;
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      <SelectInput
        name={`${prefix}core`}
        label="Cable core"
        hint="7/0.2 is seven strands of 0.2 mm: the usual alarm cable."
      >
        {CABLE_CORES.map((build) => (
          <option key={build} value={build}>
            {build} mm
          </option>
        ))}
        <option value="area">Other: give the core area</option>
      </SelectInput>
      {core === 'area' ? (
        <NumberInput
          name={`${prefix}areaMm2`}
          label="Core area (mm²)"
          hint="The cross-section of one core, e.g. 0.5."
          required="Enter the core area in mm², e.g. 0.5."
        />
      ) : null}
      <NumberInput
        name={`${prefix}runMetres`}
        label="Cable run (m)"
        hint={
          runOptional
            ? 'From the panel to the detector, one way. Leave empty to count no cable.'
            : 'From the panel to the detector, one way.'
        }
        optional={runOptional}
        required={runOptional ? undefined : 'Enter the cable run in metres.'}
      />
      <SelectInput
        name={`${prefix}coresPerLeg`}
        label="Cores per leg"
        hint="Cores doubled up share the current."
      >
        {[1, 2, 3, 4].map((cores) => (
          <option key={cores} value={cores}>
            {cores}
          </option>
        ))}
      </SelectInput>
      <NumberInput
        name={`${prefix}temperatureC`}
        label="Cable temperature (°C)"
        hint="20 °C unless the run is somewhere hot or cold."
      />
    </div>
  );
}
