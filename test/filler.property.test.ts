/**
 * Limits a filled grade must always hold (src/material/filler.ts through the model's entry points), over drawn
 * matrices, fillers, contents, shapes and orientations: stiffer than its matrix wherever the filler is stiffer
 * than the matrix, between the Reuss and Voigt bounds (Hill, Proc. Phys. Soc. A 65 (1952) 349), non-decreasing
 * in the matrix modulus (so monotone in t and T wherever the matrix is), and equal to the matrix at zero filler.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  compileMaterial,
  compositeModulusMPa,
  evaluateClocks,
  evaluateReduced,
  hillBounds,
  modulusMPa,
  ParameterError,
  type Material,
  type MaterialParams,
} from '../src/index.js';
import { filledRecord, modulusMPaArb, propertyParameters, temperatureK, timeS } from './arbitraries.js';

/** The filled material and its matrix (the same record unfilled), or null when the matrix record is refused. */
function pair(p: MaterialParams): { filled: Material; matrix: Material } | null {
  try {
    return { filled: compileMaterial(p), matrix: compileMaterial({ ...p, filler: 'none', fillerMass_pct: 0 }) };
  } catch (e) {
    if (e instanceof ParameterError) return null;
    throw e;
  }
}

const pairs = filledRecord()
  .map(pair)
  .filter((x): x is { filled: Material; matrix: Material } => x !== null);

/** Relative slack for rounding in the comparisons (set here: a few ulps of the chained arithmetic). */
const ULP = 1e-12;

describe('filled grades: limits that always hold', () => {
  it('are stiffer than the matrix and between the Reuss and Voigt bounds at every t and T', () => {
    fc.assert(
      fc.property(pairs, timeS(), temperatureK(-100, 450), ({ filled, matrix }, t, T) => {
        const c = filled.composite;
        if (c === null) return; // zero filler drawn: covered by the next property
        const Em = modulusMPa(matrix, t, T);
        const E = modulusMPa(filled, t, T);
        expect(Number.isFinite(E)).toBe(true);
        // Stiffer only where every filler modulus exceeds the matrix's (a carbon fibre's transverse 15 GPa).
        if (Em > 0 && Em <= Math.min(c.E1, c.E2, c.G)) {
          expect(E).toBeGreaterThanOrEqual(Em * (1 - ULP));
          const b = hillBounds(c, Em);
          expect(E).toBeGreaterThanOrEqual(b.reuss * (1 - ULP));
          expect(E).toBeLessThanOrEqual(b.voigt * (1 + ULP));
        }
        // The three entry points agree, and the region is the matrix's.
        const ev = evaluateClocks(filled, t, T);
        expect(ev.modulusMPa).toBe(E);
        expect(ev.region).toBe(evaluateClocks(matrix, t, T).region);
      }),
      propertyParameters(300),
    );
  });

  it('never falls as the matrix modulus rises, so it is monotone in t and T wherever the matrix is', () => {
    fc.assert(
      fc.property(pairs, modulusMPaArb(1e-3, 2e4), modulusMPaArb(1e-3, 2e4), ({ filled }, a, b) => {
        const c = filled.composite;
        if (c === null) return;
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(compositeModulusMPa(c, lo)).toBeLessThanOrEqual(compositeModulusMPa(c, hi) * (1 + ULP));
      }),
      propertyParameters(300),
    );
    fc.assert(
      fc.property(pairs, timeS(), timeS(), temperatureK(-100, 450), ({ filled, matrix }, t1, t2, T) => {
        const [a, b] = t1 <= t2 ? [t1, t2] : [t2, t1];
        if (modulusMPa(matrix, b, T) <= modulusMPa(matrix, a, T)) {
          expect(modulusMPa(filled, b, T)).toBeLessThanOrEqual(modulusMPa(filled, a, T) * (1 + ULP));
        }
      }),
      propertyParameters(200),
    );
    fc.assert(
      fc.property(pairs, timeS(), temperatureK(-100, 450), temperatureK(-100, 450), ({ filled, matrix }, t, T1, T2) => {
        const [a, b] = T1 <= T2 ? [T1, T2] : [T2, T1];
        if (modulusMPa(matrix, t, b) <= modulusMPa(matrix, t, a)) {
          expect(modulusMPa(filled, t, b)).toBeLessThanOrEqual(modulusMPa(filled, t, a) * (1 + ULP));
        }
      }),
      propertyParameters(200),
    );
  });

  it('equals the matrix at zero filler, at every entry point', () => {
    fc.assert(
      fc.property(pairs, timeS(), temperatureK(-100, 450), ({ filled, matrix }, t, T) => {
        const zero = compileMaterial({ ...filled.params, fillerMass_pct: 0 });
        expect(zero.composite).toBeNull();
        expect(modulusMPa(zero, t, T)).toBe(modulusMPa(matrix, t, T));
        expect(evaluateReduced(zero, t, 0, T).modulusMPa).toBe(evaluateReduced(matrix, t, 0, T).modulusMPa);
        if (filled.composite) expect(compositeModulusMPa({ ...filled.composite, phi: 0 }, 1234)).toBe(1234);
      }),
      propertyParameters(200),
    );
  });
});
