/** A simulated ISO 75 heat deflection test through the model. */
import { simulateHdt } from '../src/index.js';
import { material } from './core/args/material.js';
import { testStress } from './core/args/modulus.js';
import { SheetError } from './core/cells.js';
import { defineScalar } from './core/define.js';

export const HDT = defineScalar({
  id: 'HDT',
  args: [material('material'), testStress('stress')],
  run: (m, sigma) => {
    const r = simulateHdt(m, sigma);
    if (r.status === 'rubbery-throughout') {
      return new SheetError(
        '#N/A',
        `does not apply: ${m.params.id} is rubbery over the whole range (23 to 500 degC); its network holds the strain as it warms, so there is no heat deflection temperature (it is not heat-proof)`,
      );
    }
    if (r.temperatureC === null)
      return new SheetError('#N/A', `not reached: ${m.params.id} does not deflect by 0.2 % strain below 500 degC at ${sigma} MPa`);
    return r.temperatureC;
  },
});

/**
 * Simulated heat deflection temperature, in degC: constant flexural stress, heating at 120 K/h until the strain has grown by 0.2 % (ISO 75 style). Screening estimate to compare with datasheet HDT values; not design data.
 * @customfunction HDT
 * @param material Family symbol such as "PA66-dry", or a parameter block range from DERATE.PARAMS.
 * @param stress Flexural stress in MPa (or text with a unit), or the ISO 75 method letter "A" (1.80 MPa), "B" (0.45 MPa) or "C" (8.00 MPa).
 * @returns {number} Heat deflection temperature, degC.
 */
export function hdt(material: unknown[][], stress: unknown) {
  return HDT.invoke(material, stress);
}
