import { describe, expect, it } from 'vitest';
import { compileMaterial, getFamily, KELVIN_OFFSET, modulusMPa } from '../src/index.js';

/**
 * Crystal-fixed families (crystalMobility 0: polyamides, PBT, PET) above Tg over the long term. Before the late
 * creep of the crystal-bearing structure (src/material/model.ts FIXED_CREEP_N) they held a flat crystal plateau for
 * decades (PA66-cond at 80 degC: 444 MPa at 1000 h and at 1e6 h), the optimistic, unsafe direction.
 */
const DESIGN_GUIDE =
  'common practice, from memory: design-guide creep curves of unfilled PA, PBT and PET at 60 to 120 degC keep falling with log time, by roughly 5 to 15 % per decade';
const H = 3600;
const AT_80 = 80 + KELVIN_OFFSET;

describe('crystal-fixed families keep creeping above Tg', () => {
  it.each(['PA66-cond', 'PBT', 'PET'])('%s at 80 degC: E(100 000 h) / E(1000 h) between 0.7 and 0.9', (id) => {
    const m = compileMaterial(getFamily(id).params);
    const r = modulusMPa(m, 1e5 * H, AT_80) / modulusMPa(m, 1e3 * H, AT_80);
    // Two decades at 5 to 15 % each: 0.72 to 0.90 (DESIGN_GUIDE); the model is set near the middle (about 0.83).
    expect(r, `${id}: ratio ${r.toFixed(3)} (${DESIGN_GUIDE})`).toBeLessThan(0.9);
    expect(r, `${id}: ratio ${r.toFixed(3)} (${DESIGN_GUIDE})`).toBeGreaterThan(0.7);
  });

  it.each(['PA66-cond', 'PA6-cond', 'PBT', 'PET'])(
    '%s at 80 degC is still falling between 100 000 h and 1e6 h, by under 15 percent',
    (id) => {
      const m = compileMaterial(getFamily(id).params);
      const r = modulusMPa(m, 1e6 * H, AT_80) / modulusMPa(m, 1e5 * H, AT_80);
      expect(r, `${id}: one decade ${r.toFixed(3)} (${DESIGN_GUIDE})`).toBeLessThan(0.97);
      expect(r, `${id}: one decade ${r.toFixed(3)} (${DESIGN_GUIDE})`).toBeGreaterThan(0.85);
    },
  );

  it.each(['PA66-cond', 'PA66-dry', 'PBT', 'PET', 'PPS'])(
    '%s: continuous and non-increasing in time at 80 and 120 degC from 10 s to 1e6 h (DESIGN.md: continuous, monotone)',
    (id) => {
      const m = compileMaterial(getFamily(id).params);
      for (const TC of [80, 120]) {
        let prev = Infinity;
        // Steps of about 0.02 decade: a jump of over 2 % between neighbours would be a discontinuity, not creep.
        const decades = Math.log10((1e6 * H) / 10);
        for (let k = 0; k <= 400; k++) {
          const E = modulusMPa(m, 10 * 10 ** ((k / 400) * decades), TC + KELVIN_OFFSET);
          expect(E, `${id} at ${TC} degC, step ${k}`).toBeLessThanOrEqual(prev * (1 + 1e-12));
          if (prev !== Infinity) expect(E / prev, `${id} at ${TC} degC, step ${k}`).toBeGreaterThan(0.98);
          prev = E;
        }
      }
    },
  );
});
