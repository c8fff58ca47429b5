import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  compileMaterial,
  creepModulusMPa,
  fitCurves,
  getFamily,
  KELVIN_OFFSET,
  modulusMPa,
  parseCsv,
  pronyModulusMPa,
  readCurveTable,
  readDmaTable,
  rereferenceWlf,
  shiftCurves,
  resolveMaterial,
  type Curve,
  type CurveKind,
  type MaterialParams,
} from '../src/index.js';
import { inventedDmaCsv, inventedRelaxationCsv, normal, seededRandom } from '../cli/demodata.js';
import { expectClose } from './expect.js';

const K = KELVIN_OFFSET;
const ROUND = 'synthetic round trip: curves generated from known parameters with 1 % seeded noise, fitted back';

// A thermorheologically simple grade (no slow-creep clock): WLF with Tg reference C1 15, C2 60 K, and its
// transition time at Tg set to 100 s so that the 1 s to 3 h curves at 150 to 170 degC cross the transition.
const TRUTH: MaterialParams = { ...getFamily('PC').params, creepN: 0, C1: 15, C2_K: 60, tauTg_s: 100 };

function curves(kind: CurveKind, tempsC: readonly number[], seed = 7, points = 50, noise = 0.01): Curve[] {
  const m = compileMaterial(TRUTH);
  const rand = seededRandom(seed);
  return tempsC.map((c) => {
    const T = c + K;
    const t = Array.from({ length: points }, (_, i) => 10 ** ((i * 4) / (points - 1)));
    const E = t.map((x) => (kind === 'relaxation' ? modulusMPa(m, x, T) : creepModulusMPa(m, x, T)) * Math.exp(noise * normal(rand)));
    return { temperatureK: T, timesS: t, moduliMPa: E, rows: t.map((_, i) => i + 2) };
  });
}

describe('master curve, WLF and Prony from curves', () => {
  const expected = rereferenceWlf(15, 60, TRUTH.Tg_C + K, 160 + K);
  it.each(['relaxation', 'creep'] as const)('recovers C1 and C2 from %s curves at five temperatures', (kind) => {
    const fit = fitCurves({ kind, curves: curves(kind, [150, 155, 160, 165, 170]) }, { TgK: TRUTH.Tg_C + K, referenceK: 160 + K });
    expectClose(fit.shiftLaw.C1 ?? NaN, expected.C1, { rel: 0.03, source: `${ROUND}; WLF re-referenced (derived)` });
    expectClose(fit.shiftLaw.C2K ?? NaN, expected.C2K, { rel: 0.03, source: `${ROUND}; WLF re-referenced (derived)` });
    for (const s of fit.shifts) {
      const exact = (-expected.C1 * (s.temperatureK - 433.15)) / (expected.C2K + s.temperatureK - 433.15);
      expectClose(s.log10aT, exact, { abs: 0.02, source: `${ROUND}; WLF (Williams, Landel, Ferry 1955)` });
    }
    expect(fit.quality).toBe('good');
    // The fitted Prony material reproduces the truth at the reference temperature within the noise.
    // (Creep data: compared as creep moduli, the quantity that was measured.)
    const m = resolveMaterial(fit.material);
    const truth = compileMaterial(TRUTH);
    const value = kind === 'relaxation' ? modulusMPa : creepModulusMPa;
    for (const t of [3, 100, 3000]) {
      expectClose(value(m, t, 160 + K), value(truth, t, 160 + K), { rel: 0.08, source: ROUND });
    }
  });
  it('fits Arrhenius below Tg joined to WLF above it', () => {
    const fit = fitCurves(
      { kind: 'relaxation', curves: curves('relaxation', [137, 142, 147, 152, 157, 162]) },
      { TgK: TRUTH.Tg_C + K, referenceK: 152 + K },
    );
    expect(fit.shiftLaw.law).toBe('hybrid');
    expectClose(fit.shiftLaw.EakJmol ?? NaN, TRUTH.Ea_kJmol, { rel: 0.05, source: `${ROUND}; Arrhenius below Tg` });
  });
  it('fits the 5 x 50 master curve with one Prony term per decade when asked, and flags it', () => {
    const fit = fitCurves(
      { kind: 'relaxation', curves: curves('relaxation', [150, 155, 160, 165, 170]) },
      { TgK: TRUTH.Tg_C + K, termsPerDecade: 1 },
    );
    expect(fit.termsPerDecade).toBe(1);
    expect(fit.prony.terms.every((t) => t.EMPa >= 0)).toBe(true);
    // One term per decade cannot follow this steep transition: the flag says so rather than hiding it.
    expect(fit.pronyQuality).not.toBe('good');
    const auto = fitCurves({ kind: 'relaxation', curves: curves('relaxation', [150, 155, 160, 165, 170]) }, { TgK: TRUTH.Tg_C + K });
    expect(auto.pronyQuality).toBe('good');
    expect(auto.notes.join(' ')).toMatch(/per decade were used/);
    for (const p of auto.master.filter((_, i) => i % 25 === 0)) {
      expectClose(pronyModulusMPa(auto.prony, p.reducedTimeS), p.modulusMPa, {
        rel: 0.1,
        source: `${ROUND}; Prony fit within noise and ripple`,
      });
    }
  });
  it('refuses curves that do not overlap', () => {
    expect(() => shiftCurves({ kind: 'relaxation', curves: curves('relaxation', [150, 190]) })).toThrow(/cannot be overlapped/);
  });
  it('refuses a single curve and a reference that is not a curve temperature', () => {
    expect(() => fitCurves({ kind: 'relaxation', curves: curves('relaxation', [150]) })).toThrow(/2 or more temperatures/);
    expect(() => fitCurves({ kind: 'relaxation', curves: curves('relaxation', [150, 155, 160]) }, { referenceK: 300 })).toThrow(
      /not one of the curve temperatures/,
    );
  });
});

describe('test-data tables', () => {
  const good = 'temperature_C,time_s,modulus_MPa\n80,1,1000\n80,10,900\n80,100,800\n80,1000,700\n80,10000,600\n';
  it('reads a clean table, converting units from the header', () => {
    const set = readCurveTable(
      parseCsv('# invented\ntemperature [K],time_h,modulus_GPa\n353.15,1,1\n353.15,2,0.9\n353.15,3,0.8\n353.15,4,0.7\n353.15,5,0.6\n'),
    );
    expect(set.kind).toBe('relaxation');
    expectClose(set.curves[0]?.temperatureK ?? NaN, 353.15, { abs: 1e-9, source: 'unit conversion (SI definition of the kelvin)' });
    expectClose(set.curves[0]?.timesS[1] ?? NaN, 7200, { abs: 1e-9, source: '1 h = 3600 s (SI)' });
    expectClose(set.curves[0]?.moduliMPa[0] ?? NaN, 1000, { abs: 1e-9, source: '1 GPa = 1000 MPa (SI)' });
  });
  it('reads compliance as creep data', () => {
    const set = readCurveTable(
      parseCsv('temperature_C,time_s,compliance_1/GPa\n80,1,1\n80,10,1.1\n80,100,1.2\n80,1000,1.3\n80,10000,1.4\n'),
    );
    expect(set.kind).toBe('creep');
    expectClose(set.curves[0]?.moduliMPa[0] ?? NaN, 1000, { rel: 1e-12, source: 'creep modulus = 1 / compliance' });
  });
  it('refuses too few points', () => {
    expect(() => readCurveTable(parseCsv('temperature_C,time_s,modulus_MPa\n80,1,1000\n80,10,900\n'))).toThrow(
      /has 2 points; a curve needs at least 5/,
    );
  });
  it('refuses times that do not increase', () => {
    expect(() => readCurveTable(parseCsv(good.replace('80,100,800', '80,5,800')))).toThrow(/time at row 4 does not increase/);
  });
  it('refuses a relaxation modulus that rises beyond noise', () => {
    expect(() => readCurveTable(parseCsv(good.replace('80,1000,700', '80,1000,950')))).toThrow(
      /row 5 is .* above an earlier point; a relaxation modulus cannot rise/,
    );
  });
  it('refuses mixed units in one column', () => {
    expect(() => readCurveTable(parseCsv(good.replace('80,100,800', '80,2 min,800')))).toThrow(
      /row 4, time_s: '2 min' is in another unit than its column \(s\); mixed units/,
    );
    // The column's own unit in a cell is fine.
    expect(readCurveTable(parseCsv(good.replace('80,100,800', '80,100 s,800'))).curves[0]?.timesS[2]).toBe(100);
  });
  it('refuses NaN and empty cells, naming the row', () => {
    expect(() => readCurveTable(parseCsv(good.replace('80,100,800', '80,100,NaN')))).toThrow(/row 4, modulus_MPa: 'NaN' is not a number/);
    expect(() => readCurveTable(parseCsv(good.replace('80,100,800', '80,100,')))).toThrow(
      /row 4, modulus_MPa is empty; fill it or delete the row \(nothing is dropped silently\)/,
    );
  });
  it('refuses a header without units and an interrupted curve', () => {
    expect(() => readCurveTable(parseCsv('temperature,time_s,modulus_MPa\n'))).toThrow(/needs a unit/);
    expect(() => readCurveTable(parseCsv(good + '90,1,500\n90,2,400\n90,3,300\n90,4,200\n90,5,100\n80,20000,500\n'))).toThrow(
      /interrupted/,
    );
  });
  it('refuses a DMA sweep with too few points or falling temperatures', () => {
    expect(() => readDmaTable(parseCsv('temperature_C,storage_MPa\n20,2000\n30,1900\n'))).toThrow(/at least 8 points/);
    expect(() => readDmaTable(parseCsv('temperature_C,storage_MPa\n20,2000\n10,1900\n'))).toThrow(/temperatures must increase/);
  });
});

describe('invented demo data', () => {
  it('files match their generator and are labelled as invented', () => {
    const rel = readFileSync(new URL('../demo/latch-pc-relaxation-invented.csv', import.meta.url), 'utf8');
    const dma = readFileSync(new URL('../demo/latch-pc-dma-invented.csv', import.meta.url), 'utf8');
    expect(rel).toBe(inventedRelaxationCsv());
    expect(dma).toBe(inventedDmaCsv());
    expect(rel.split('\n')[0]).toMatch(/INVENTED/);
    expect(dma.split('\n')[0]).toMatch(/INVENTED/);
  });
  it('fit back to the invented grade (WLF at 152 degC from C1 16, C2 55 K at Tg 149 degC)', () => {
    const fit = fitCurves(
      readCurveTable(parseCsv(readFileSync(new URL('../demo/latch-pc-relaxation-invented.csv', import.meta.url), 'utf8'))),
      {
        TgK: 149 + K,
      },
    );
    const e = rereferenceWlf(16, 55, 149 + K, 152 + K);
    expectClose(fit.shiftLaw.C1 ?? NaN, e.C1, { rel: 0.05, source: 'invented demo grade; WLF re-referenced (derived)' });
    expectClose(fit.shiftLaw.C2K ?? NaN, e.C2K, { rel: 0.05, source: 'invented demo grade; WLF re-referenced (derived)' });
    expect(fit.quality).toBe('good');
  });
});
