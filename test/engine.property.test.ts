/**
 * Property tests over the engine's public entry points (src/index.ts), seeded and bounded (see
 * test/arbitraries.ts for RD_PROPERTY_RUNS / RD_PROPERTY_SEED). The properties are the model's own
 * invariants (DESIGN.md): parsers answer a finite engine-unit number or an InputError naming the
 * argument; results are finite; monotone in t and T (a crosslinked network's entropic rise excepted);
 * inverse answers round-trip or say why not; band low <= central <= high.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  upperBoundMPa,
  apparentTgK,
  bandEstimate,
  compileMaterial,
  convertStressFromMPa,
  deratingRatio,
  deratingTable,
  equivalentTimeS,
  evaluateClocks,
  FAMILIES,
  InputError,
  MAX_TEMPERATURE_C,
  MIN_TEMPERATURE_K,
  maxTemperatureK,
  maxTimeS,
  modulusAfterHistory,
  modulusMPa,
  ParameterError,
  paramsFromRecord,
  parseStrain,
  parseStressMPa,
  parseTemperatureK,
  parseTimeS,
  retainedStressMPa,
  shiftLog10,
  simulateHdt,
  SolverError,
  T23_K,
  TEMP_SEARCH_K,
  TIME_SEARCH_S,
  RELAXED_MPA,
  UnknownFamilyError,
  type Material,
  type MaterialParams,
} from '../src/index.js';
import {
  anyText,
  familyIdText,
  KNOWN_UNITS,
  looseRecord,
  modulusMPaArb,
  paramRecord,
  parserInput,
  propertyParameters,
  temperatureK,
  timeS,
} from './arbitraries.js';

/** Compiles a drawn record, or returns null when compileMaterial refuses it with a ParameterError (checked elsewhere). */
function tryCompile(p: MaterialParams): Material | null {
  try {
    return compileMaterial(p);
  } catch (e) {
    if (e instanceof ParameterError) return null;
    throw e;
  }
}

/** Bundled families or drawn records that compile; hybrid and Arrhenius laws only (defined at every T > 0). */
const everywhereDefined: fc.Arbitrary<Material> = fc.oneof(
  fc.constantFrom(...FAMILIES.map((f) => compileMaterial(f.params))),
  paramRecord(undefined, ['hybrid', 'arrhenius'])
    .map(tryCompile)
    .filter((m): m is Material => m !== null),
);

/** Any compiled material, pure WLF included (undefined at and below Tg - C2 + 1 K). */
const anyMaterial: fc.Arbitrary<Material> = fc.oneof(
  everywhereDefined,
  paramRecord()
    .map(tryCompile)
    .filter((m): m is Material => m !== null),
);

/** Evaluates or returns null where a pure WLF law is undefined (the one documented InputError of an evaluation). */
function wlfGuard<T>(m: Material, f: () => T): T | null {
  try {
    return f();
  } catch (e) {
    if (m.shift.law === 'wlf' && e instanceof InputError && e.argument === 'temperature' && /WLF singularity/.test(e.message)) return null;
    throw e;
  }
}

function expectFinite(x: number, what: string): void {
  expect(Number.isFinite(x), `${what} = ${x}`).toBe(true);
}

/** Tolerance for "non-increasing": one part in 1e12 of rounding. */
const ROUND = 1e-12;

describe('parsers: a finite number in engine units or an InputError naming the argument', () => {
  const cases = [
    {
      name: 'parseTemperatureK',
      parse: parseTemperatureK,
      q: 'temperature',
      ok: (x: number) => x >= MIN_TEMPERATURE_K && x <= MAX_TEMPERATURE_C + 273.15,
    },
    { name: 'parseTimeS', parse: parseTimeS, q: 'time', ok: (x: number) => x > 0 },
    { name: 'parseStressMPa', parse: parseStressMPa, q: 'stress', ok: (x: number) => x > 0 },
    { name: 'parseStrain', parse: parseStrain, q: undefined, ok: () => true },
  ] as const;
  for (const c of cases) {
    it(c.name, () => {
      fc.assert(
        fc.property(parserInput(c.q), fc.constantFrom('arg_x', '--opt'), (input, argument) => {
          let value: number;
          try {
            value = c.parse(input, argument);
          } catch (e) {
            expect(e).toBeInstanceOf(InputError);
            expect((e as InputError).argument).toBe(argument);
            expect((e as InputError).message.startsWith(`${argument}: `)).toBe(true);
            return;
          }
          expectFinite(value, `${c.name}(${JSON.stringify(input)})`);
          expect(c.ok(value), `${c.name}(${JSON.stringify(input)}) = ${value}`).toBe(true);
        }),
        propertyParameters(400),
      );
    });
  }
  it('bare numbers and their text agree (degC, hours, MPa)', () => {
    fc.assert(
      fc.property(fc.double({ min: MIN_TEMPERATURE_K - 273.15, max: MAX_TEMPERATURE_C, noNaN: true }), (x) => {
        if (Object.is(x, -0)) return;
        expect(parseTemperatureK(String(x))).toBe(parseTemperatureK(x));
        if (x > 0) {
          expect(parseTimeS(String(x))).toBe(parseTimeS(x));
          expect(parseStressMPa(String(x))).toBe(parseStressMPa(x));
        }
      }),
      propertyParameters(200),
    );
  });
});

describe('parameter records', () => {
  it('paramsFromRecord + compileMaterial: a material or a ParameterError naming a field, nothing else', () => {
    fc.assert(
      fc.property(looseRecord(), (record) => {
        let m: Material;
        try {
          m = compileMaterial(paramsFromRecord(record));
        } catch (e) {
          expect(e).toBeInstanceOf(ParameterError);
          expect((e as ParameterError).field).toBeTypeOf('string');
          expect((e as ParameterError).message).toMatch(/^parameter /);
          return;
        }
        expectFinite(m.EgMPa, 'EgMPa');
        expect(m.EgMPa).toBeGreaterThan(0);
      }),
      propertyParameters(300),
    );
  });
  it('records valid by construction compile, or are refused only for the E23 anchor or the glassy / rubbery ratio', () => {
    fc.assert(
      fc.property(paramRecord(), (p) => {
        try {
          compileMaterial(p);
        } catch (e) {
          expect(e).toBeInstanceOf(ParameterError);
          expect(['E23_MPa', 'Eg_MPa']).toContain((e as ParameterError).field);
        }
      }),
      propertyParameters(300),
    );
  });
});

describe('modulus', () => {
  it('is finite, >= 0 and at most the glassy modulus (hybrid and Arrhenius laws, 1 ms to 1000 years, -150 to 500 degC)', () => {
    fc.assert(
      fc.property(everywhereDefined, timeS(), temperatureK(), (m, t, T) => {
        const e = evaluateClocks(m, t, T);
        expectFinite(e.modulusMPa, `E(${t} s, ${T} K)`);
        expect(e.modulusMPa).toBeGreaterThanOrEqual(0);
        // A network's entropic modulus 3 rho R T / Mc may pass a low glassy modulus only far above 500 degC (Eg >= 10 Er(23 degC)).
        expect(e.modulusMPa).toBeLessThanOrEqual(upperBoundMPa(m) * (1 + ROUND));
      }),
      propertyParameters(400),
    );
  });
  it('is finite at any temperature the parser accepts (MIN_TEMPERATURE_K to MAX_TEMPERATURE_C), and down to the smallest double, at any time', () => {
    fc.assert(
      fc.property(
        everywhereDefined,
        fc.oneof(timeS(), fc.constantFrom(Number.MIN_VALUE, 1e-300, 1e300, Number.MAX_VALUE)),
        fc.oneof(temperatureK(-273.15, MAX_TEMPERATURE_C), fc.constantFrom(Number.MIN_VALUE, 1e-300, 1e-3, 1, MAX_TEMPERATURE_C + 273.15)),
        (m, t, T) => {
          expectFinite(modulusMPa(m, t, T), `E(${t} s, ${T} K)`);
        },
      ),
      propertyParameters(300),
    );
  });
  it('shift factors that over- or underflow (10 ** x beyond 1e308) never give NaN, up to 1e308 K', () => {
    fc.assert(
      fc.property(
        everywhereDefined.filter((m) => m.kind !== 'crosslinked'),
        fc.oneof(timeS(), fc.constantFrom(Number.MIN_VALUE, Number.MAX_VALUE)),
        fc.constantFrom(Number.MIN_VALUE, 1e-300, 1e-10, 1e10, 1e300, 1e308),
        (m, t, T) => {
          expectFinite(modulusMPa(m, t, T), `E(${t} s, ${T} K)`);
        },
      ),
      propertyParameters(200),
    );
  });
  it('is non-increasing in time', () => {
    fc.assert(
      fc.property(anyMaterial, timeS(), timeS(), temperatureK(), (m, t1, t2, T) => {
        const [a, b] = t1 <= t2 ? [t1, t2] : [t2, t1];
        const r = wlfGuard(m, () => [modulusMPa(m, a, T), modulusMPa(m, b, T)] as const);
        if (r === null) return;
        expect(r[1]).toBeLessThanOrEqual(r[0] * (1 + ROUND));
      }),
      propertyParameters(400),
    );
  });
  it('is non-increasing in temperature; for a network, E - 3 rho R T / Mc is (the entropic rise, model.ts)', () => {
    fc.assert(
      fc.property(anyMaterial, timeS(), temperatureK(), temperatureK(), (m, t, T1, T2) => {
        const [a, b] = T1 <= T2 ? [T1, T2] : [T2, T1];
        const r = wlfGuard(m, () => [modulusMPa(m, t, a), modulusMPa(m, t, b)] as const);
        if (r === null) return;
        const rubber = (T: number): number => m.networkMPaPerK * T;
        const lo = r[0] - rubber(a);
        const hi = r[1] - rubber(b);
        expect(hi).toBeLessThanOrEqual(lo + ROUND * Math.max(r[0], 1e-300));
      }),
      propertyParameters(400),
    );
  });
  it('pure WLF: a clear InputError at and below Tg - C2 + 1 K, finite above', () => {
    fc.assert(
      fc.property(
        paramRecord(undefined, ['wlf'])
          .map(tryCompile)
          .filter((m): m is Material => m !== null),
        fc.double({ min: -5, max: 5, noNaN: true }),
        timeS(),
        (m, offset, t) => {
          const singular = m.shift.TrefK - m.shift.C2K + 1;
          const T = singular + offset;
          if (T <= 0) return;
          if (Math.abs(offset) < 1e-6) return; // rounding of T - Tg at the boundary itself
          if (offset <= 0) {
            expect(() => modulusMPa(m, t, T)).toThrow(/^temperature: .* is at or below the WLF singularity/);
          } else {
            expectFinite(modulusMPa(m, t, T), `E at ${offset} K above the singularity margin`);
          }
        },
      ),
      propertyParameters(200),
    );
  });
  it('hybrid: finite on both sides of where a pure WLF law would be singular', () => {
    fc.assert(
      fc.property(
        paramRecord(undefined, ['hybrid'])
          .map(tryCompile)
          .filter((m): m is Material => m !== null),
        fc.double({ min: -5, max: 5, noNaN: true }),
        timeS(),
        (m, offset, t) => {
          const T = m.shift.TrefK - m.shift.C2K + offset;
          if (T <= 0) return;
          expectFinite(modulusMPa(m, t, T), 'E near Tg - C2');
          expectFinite(shiftLog10(m.shift, T), 'log10 aT near Tg - C2');
        },
      ),
      propertyParameters(200),
    );
  });
});

const RANGE_FIELDS = ['Tg_low_C', 'Tg_high_C', 'Tm_low_C', 'Tm_high_C', 'E23_low_MPa', 'E23_high_MPa'];

describe('band', () => {
  it('low <= central <= high, all finite, central = the modulus', () => {
    fc.assert(
      fc.property(anyMaterial, timeS(), temperatureK(), (m, t, T) => {
        if (wlfGuard(m, () => modulusMPa(m, t, T)) === null) return;
        let b;
        try {
          b = bandEstimate(m, t, T);
        } catch (e) {
          // A corner of the ranges that cannot be compiled or evaluated is named by its range field.
          expect(e).toBeInstanceOf(ParameterError);
          expect(RANGE_FIELDS).toContain((e as ParameterError).field);
          expect((e as Error).message).toMatch(/the band corner .* cannot be evaluated/);
          return;
        }
        for (const x of [b.lowMPa, b.centralMPa, b.highMPa]) expectFinite(x, 'band');
        expect(b.lowMPa).toBeLessThanOrEqual(b.centralMPa);
        expect(b.centralMPa).toBeLessThanOrEqual(b.highMPa);
        expect(b.centralMPa).toBe(modulusMPa(m, t, T));
      }),
      propertyParameters(300),
    );
  });
});

const ROUND_TRIP = 1e-6;

describe('inverse answers', () => {
  it('maxTemperatureK: E at the answer equals the target within 1e-6, or an explicit status that holds', () => {
    fc.assert(
      fc.property(anyMaterial, modulusMPaArb(), timeS(), (m, req, t) => {
        let a;
        try {
          a = maxTemperatureK(m, req, t);
        } catch (e) {
          expect(e).not.toBeInstanceOf(SolverError);
          throw e;
        }
        const [lo, hi] = TEMP_SEARCH_K;
        if (a.status === 'found') {
          expect(a.value).not.toBeNull();
          const T = a.value ?? NaN;
          expect(T).toBeGreaterThanOrEqual(lo - 1e-9);
          expect(T).toBeLessThanOrEqual(hi + 1e-9);
          expect(Math.abs(modulusMPa(m, t, T) / req - 1)).toBeLessThanOrEqual(ROUND_TRIP);
        } else if (a.status === 'above-throughout') {
          expect(a.value).toBeNull();
          expect(modulusMPa(m, t, hi)).toBeGreaterThanOrEqual(req * (1 - ROUND));
        } else if (a.status === 'below-between') {
          // Only a network (its 3 rho R T / Mc rises with T) is below the requirement inside the range and above it at the top.
          expect(m.kind).toBe('crosslinked');
          const [from, to] = a.below ?? [NaN, NaN];
          expect(Math.abs(modulusMPa(m, t, to) / req - 1)).toBeLessThanOrEqual(ROUND_TRIP);
          if (a.value !== null) expect(Math.abs(modulusMPa(m, t, from) / req - 1)).toBeLessThanOrEqual(ROUND_TRIP);
          expect(modulusMPa(m, t, hi)).toBeGreaterThanOrEqual(req * (1 - ROUND));
        } else {
          expect(a.value).toBeNull();
          const Tlow = m.shift.law === 'wlf' ? Math.max(lo, m.shift.TrefK - m.shift.C2K + 1 + 1e-6) : lo;
          // For a network E - Er is non-increasing and Er rises, so the two ends bound E: both must be below.
          expect(modulusMPa(m, t, Tlow)).toBeLessThan(req * (1 + ROUND));
          expect(modulusMPa(m, t, hi)).toBeLessThan(req);
        }
      }),
      propertyParameters(300),
    );
  });
  it('maxTimeS: E at the answer equals the target within 1e-6, or an explicit status that holds', () => {
    fc.assert(
      fc.property(anyMaterial, modulusMPaArb(), temperatureK(), (m, req, T) => {
        const a = wlfGuard(m, () => maxTimeS(m, req, T));
        if (a === null) return;
        const [lo, hi] = TIME_SEARCH_S;
        if (a.status === 'found') {
          const t = a.value ?? NaN;
          expect(t).toBeGreaterThanOrEqual(lo * (1 - 1e-9));
          expect(t).toBeLessThanOrEqual(hi * (1 + 1e-9));
          expect(Math.abs(modulusMPa(m, t, T) / req - 1)).toBeLessThanOrEqual(ROUND_TRIP);
        } else if (a.status === 'above-throughout') {
          expect(modulusMPa(m, hi, T)).toBeGreaterThanOrEqual(req * (1 - ROUND));
        } else {
          expect(modulusMPa(m, lo, T)).toBeLessThan(req);
        }
      }),
      propertyParameters(300),
    );
  });
  it('apparentTgK: the shift at the answer is log10(t / tauTg), or null', () => {
    fc.assert(
      fc.property(anyMaterial, timeS(), (m, t) => {
        const T = apparentTgK(m, t);
        if (T === null) return;
        expectFinite(T, 'apparent Tg');
        expect(T).toBeGreaterThan(0);
        const target = Math.log10(t / m.tauTg);
        expect(Math.abs(shiftLog10(m.shift, T) - target)).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(target)));
      }),
      propertyParameters(300),
    );
  });
});

/** Segments of up to 10 h: 20 of them repeated 3650 times last at most 83 years, inside the model's 100. */
const segment = fc.record({ TK: temperatureK(-50, 300), dtS: timeS(1e-3, 3.6e4) });

describe('histories', () => {
  it('equivalentTimeS: finite, positive; equal to the duration for a constant history at Tref', () => {
    fc.assert(
      fc.property(
        everywhereDefined,
        fc.array(segment, { minLength: 1, maxLength: 20 }),
        temperatureK(-50, 300),
        fc.integer({ min: 1, max: 3650 }),
        (m, segs, Tref, cycles) => {
          let teq = NaN;
          try {
            teq = equivalentTimeS(m, segs, Tref, cycles);
          } catch (e) {
            // A reference much colder (or hotter) than the history puts the equivalent time outside 1 ms to 100 years.
            expect((e as InputError).argument).toBe('ref_temperature');
          }
          if (!Number.isNaN(teq)) {
            expect(teq).toBeGreaterThanOrEqual(TIME_SEARCH_S[0]);
            expect(teq).toBeLessThanOrEqual(TIME_SEARCH_S[1]);
          }
          const flat = equivalentTimeS(
            m,
            segs.map((s) => ({ TK: Tref, dtS: s.dtS })),
            Tref,
            cycles,
          );
          const total = segs.reduce((s, x) => s + x.dtS, 0) * cycles;
          expect(Math.abs(flat / total - 1)).toBeLessThanOrEqual(1e-12);
        },
      ),
      propertyParameters(200),
    );
  });
  it('modulusAfterHistory: finite, within [0, Eg]; a constant history equals the constant-temperature modulus', () => {
    fc.assert(
      fc.property(
        everywhereDefined,
        fc.array(segment, { minLength: 1, maxLength: 20 }),
        fc.integer({ min: 1, max: 3650 }),
        (m, segs, cycles) => {
          const e = modulusAfterHistory(m, segs, cycles);
          expectFinite(e.modulusMPa, 'modulus after history');
          expect(e.modulusMPa).toBeGreaterThanOrEqual(0);
          expect(e.modulusMPa).toBeLessThanOrEqual(upperBoundMPa(m) * (1 + ROUND));
          const T = segs[0]?.TK ?? T23_K;
          const total = segs.reduce((s, x) => s + x.dtS, 0) * cycles;
          const flat = modulusAfterHistory(
            m,
            segs.map((s) => ({ TK: T, dtS: s.dtS })),
            cycles,
          ).modulusMPa;
          const direct = modulusMPa(m, total, T);
          expect(Math.abs(flat - direct)).toBeLessThanOrEqual(1e-9 * Math.max(direct, 1e-300) + 1e-300);
        },
      ),
      propertyParameters(200),
    );
  });
  it('retainedStressMPa: sigma = E eps, finite, for strains in (0, 0.1]; InputError outside', () => {
    fc.assert(
      fc.property(everywhereDefined, fc.double({ min: -0.2, max: 0.3, noNaN: true }), timeS(), temperatureK(), (m, eps, t, T) => {
        if (!(eps > 0) || eps > 0.1) {
          expect(() => retainedStressMPa(m, eps, t, T)).toThrow(InputError);
          return;
        }
        const r = retainedStressMPa(m, eps, t, T);
        expectFinite(r.stressMPa, 'stress');
        expect(r.stressMPa).toBe(r.modulusMPa * eps);
      }),
      propertyParameters(200),
    );
  });
});

describe('HDT and derating table', () => {
  it('simulateHdt: a temperature between 23 and 500 degC or null; the end modulus below the start one', () => {
    fc.assert(
      fc.property(everywhereDefined, fc.oneof(fc.constantFrom(0.45, 1.8, 8), modulusMPaArb(0.01, 100)), (m, stress) => {
        const r = simulateHdt(m, stress);
        expectFinite(r.startModulusMPa, 'start modulus');
        expectFinite(r.endModulusMPa, 'end modulus');
        if (r.startModulusMPa > 0) expect(r.endModulusMPa).toBeLessThanOrEqual(r.startModulusMPa * (1 + ROUND));
        else expect(r.temperatureC).toBe(23);
        if (r.temperatureC !== null) {
          expectFinite(r.temperatureC, 'HDT');
          expect(r.temperatureC).toBeGreaterThanOrEqual(23);
          expect(r.temperatureC).toBeLessThanOrEqual(500);
        }
      }),
      propertyParameters(40),
    );
  });
  it('deratingTable: one finite cell per temperature, ratio = modulus / reference; unknown ids throw UnknownFamilyError', () => {
    fc.assert(
      fc.property(
        fc.array(familyIdText(), { minLength: 1, maxLength: 3 }),
        fc.array(fc.double({ min: -150, max: 500, noNaN: true }), { minLength: 1, maxLength: 6 }),
        timeS(),
        (ids, temps, t) => {
          let rows;
          try {
            rows = deratingTable(ids, temps, t);
          } catch (e) {
            expect(e).toBeInstanceOf(UnknownFamilyError);
            return;
          }
          expect(rows).toHaveLength(ids.length);
          for (const r of rows) {
            expectFinite(r.referenceMPa, 'reference');
            expect(r.cells).toHaveLength(temps.length);
            for (const c of r.cells) {
              expectFinite(c.modulusMPa, 'cell');
              // A bundled family is solid at 23 degC after 1 h, so every ratio exists.
              expect(c.ratio).toBe(c.modulusMPa / r.referenceMPa);
            }
          }
        },
      ),
      propertyParameters(100),
    );
  });
  it('deratingTable and deratingRatio over drawn records: finite ratios, or no ratio when the reference has relaxed below RELAXED_MPA', () => {
    fc.assert(
      fc.property(
        everywhereDefined,
        fc.array(fc.double({ min: -150, max: 500, noNaN: true }), { minLength: 1, maxLength: 4 }),
        timeS(),
        (m, temps, t) => {
          let rows;
          try {
            rows = deratingTable([m.params], temps, t);
          } catch (e) {
            // Only a shift law undefined at a column (pure WLF below Tg - C2 + 1 K) is refused, naming the column list.
            expect(e).toBeInstanceOf(InputError);
            expect((e as InputError).argument).toBe('temperatures');
            expect(m.shift.law).toBe('wlf');
            return;
          }
          const relaxed = (rows[0]?.referenceMPa ?? 0) < RELAXED_MPA;
          for (const c of rows[0]?.cells ?? []) {
            if (relaxed) {
              // No ratio to a melt: null in the table, an InputError naming the reference in RATIO.
              expect(c.ratio).toBeNull();
              let err: unknown;
              try {
                deratingRatio(m, t, c.temperatureC + 273.15);
              } catch (e) {
                err = e;
              }
              expect(err).toBeInstanceOf(InputError);
              expect(['ref_temperature', 'ref_time']).toContain((err as InputError).argument);
              continue;
            }
            expectFinite(c.ratio ?? NaN, 'ratio');
            expect(deratingRatio(m, t, c.temperatureC + 273.15)).toBe(c.ratio);
          }
        },
      ),
      propertyParameters(200),
    );
  });
});

describe('units out', () => {
  it('convertStressFromMPa: finite, or an InputError naming the unit argument', () => {
    fc.assert(
      fc.property(modulusMPaArb(1e-6, 1e6), fc.oneof(fc.constantFrom(...KNOWN_UNITS.stress), anyText()), (x, unit) => {
        let y: number;
        try {
          y = convertStressFromMPa(x, unit, 'unit');
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          expect((e as InputError).argument).toBe('unit');
          return;
        }
        expectFinite(y, `convert ${x} MPa to '${unit}'`);
        expect(y).toBeGreaterThan(0);
      }),
      propertyParameters(300),
    );
  });
});

describe('equivalent time over the whole span', () => {
  it('inside 1 ms to 100 years, or an InputError naming the argument; never NaN or Infinity', () => {
    fc.assert(
      fc.property(
        anyMaterial,
        fc.array(fc.record({ TK: temperatureK(), dtS: timeS() }), { minLength: 1, maxLength: 8 }),
        temperatureK(),
        (m, segs, Tref) => {
          let teq: number;
          try {
            teq = equivalentTimeS(m, segs, Tref, 3650);
          } catch (e) {
            expect(e).toBeInstanceOf(InputError);
            const arg = (e as InputError).argument;
            if (arg === 'temperatures') expect(m.shift.law).toBe('wlf');
            else expect(['ref_temperature', 'cycles']).toContain(arg);
            return;
          }
          expectFinite(teq, 'equivalent time');
          expect(teq).toBeGreaterThanOrEqual(TIME_SEARCH_S[0]);
          expect(teq).toBeLessThanOrEqual(TIME_SEARCH_S[1]);
        },
      ),
      propertyParameters(300),
    );
  });
});
