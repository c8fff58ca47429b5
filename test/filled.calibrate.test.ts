import { describe, expect, it } from 'vitest';
import { calibrateDatasheet, compileMaterial, DATASHEET_TIME_S, getGrade, modulusMPa, T23_K } from '../src/index.js';
import { expectClose } from './expect.js';

/**
 * Calibration of a filled grade (src/fit/calibrate.ts FILLER_FREE_PREFERENCE): its datasheet modulus and HDT/A
 * move the filler's orientation and aspect ratio first, and the matrix (the bundled family) stays as it is.
 */
describe('calibrating a filled grade', () => {
  it('fits the 23 degC modulus through the fibre orientation alone, the matrix untouched', () => {
    const start = getGrade('PA66-dry-GF30').params;
    const r = calibrateDatasheet('PA66-dry-GF30', { modulus23MPa: 9500 });
    expect(r.free.map((f) => f.field)).toEqual(['fillerAlign']);
    // Round trip: the calibrated record reproduces its input (the datasheet number of the call above).
    expectClose(modulusMPa(compileMaterial(r.params), DATASHEET_TIME_S, T23_K), 9500, {
      rel: 0.0005,
      source: 'round trip: the modulus given to the calibration',
    });
    expect(r.params.E23_MPa).toBe(start.E23_MPa);
    expect(r.params.crystallinity).toBe(start.crystallinity);
    expect(r.params.fillerAspect).toBe(25);
    expect(r.quality).toBe('good');
  });

  it('gives the modulus and HDT/A to the orientation and the aspect ratio before any matrix parameter', () => {
    // Common practice, from memory: PA66-GF30 dry, about 10 GPa and HDT/A about 250 degC.
    const r = calibrateDatasheet('PA66-dry-GF30', { modulus23MPa: 10000, hdt: [{ stressMPa: 1.8, temperatureK: 250 + 273.15 }] });
    expect(r.free.map((f) => f.field).sort()).toEqual(['fillerAlign', 'fillerAspect']);
    const start = getGrade('PA66-dry-GF30').params;
    for (const k of ['E23_MPa', 'crystallinity', 'meltSharpness', 'Tg_C', 'Tm_C'] as const) expect(r.params[k]).toBe(start[k]);
  });

  it('still sets an unfilled family modulus directly', () => {
    const r = calibrateDatasheet('PA66-dry', { modulus23MPa: 3000 });
    expect(r.free).toEqual([]);
    expect(r.params.E23_MPa).toBe(3000);
  });
});
