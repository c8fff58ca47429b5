/** The pane's plans: family blocks, review formulas and the numbers shown beside them. */
import { describe, expect, it } from 'vitest';
import {
  ALL_KEYS,
  compileMaterial,
  cToKelvin,
  FAMILIES,
  getFamily,
  InputError,
  modulusMPa,
  NUMERIC_FIELDS,
  FILLED_GRADE_IDS,
  parseTimeS,
  TEXT_FIELDS,
} from '../src/index.js';
import { boxAddress, columnName, parseCell, parseRef, qualified, quoteSheet } from '../addin/sheet/a1.js';
import { blockRows, familyBlockPlan, parameterRows, searchFamilies, summarize } from '../addin/jobs/lookup/plan.js';
import { formatModulus } from '../addin/sheet/port.js';
import { paramsBlock } from '../functions/core/block.js';
import {
  paramsFromBlock,
  parseRequired,
  parseServiceTime,
  parseTemperatureList,
  reviewModulus,
  reviewLayout,
  reviewPlan,
  type ReviewInput,
} from '../addin/jobs/review/plan.js';
import { chartSpanC, CURVE_SAMPLES, logAxisMinimum } from '../addin/jobs/review/chart.js';
import { CURVE } from '../functions/tables.js';
import { MAXTEMP } from '../functions/limits.js';
import { expectClose } from './expect.js';

const ENGINE = 'engine modulusMPa, the call DERATE.MODULUS makes (consistency of pane and functions)';

describe('A1 addresses', () => {
  it('names columns as spreadsheets do (A..Z, AA, XFD is the 16384th)', () => {
    expect([0, 25, 26, 51, 52, 701, 702, 16383].map(columnName)).toEqual(['A', 'Z', 'AA', 'AZ', 'BA', 'ZZ', 'AAA', 'XFD']);
    expect(() => columnName(16384)).toThrow(RangeError);
  });
  it('parses and prints references with quoted sheet names', () => {
    expect(parseCell('$C$12')).toEqual({ row: 11, col: 2 });
    expect(parseRef("'Q3 review'!B2:A1")).toEqual({ sheet: 'Q3 review', box: { top: 0, left: 0, bottom: 1, right: 1 } });
    expect(parseRef("'It''s'!D4").sheet).toBe("It's");
    expect(quoteSheet('Sheet1')).toBe('Sheet1');
    expect(quoteSheet('Review 1')).toBe("'Review 1'");
    expect(quoteSheet('A1')).toBe("'A1'");
    expect(qualified('Review 1', { top: 0, left: 3, bottom: 28, right: 4 })).toBe("'Review 1'!$D$1:$E$29");
    expect(boxAddress({ top: 4, left: 1, bottom: 4, right: 1 })).toBe('B5');
    expect(() => parseRef('Sheet1!')).toThrow(/not a cell address/);
  });
});

describe('families job', () => {
  it('searches by symbol, name and kind', () => {
    // The families, then the listed filled grades of them (FILLED_GRADE_IDS, src/material/grade.ts).
    expect(searchFamilies('pa66').map((f) => f.params.id)).toEqual(['PA66-dry', 'PA66-cond', 'PA66-dry-GF30', 'PA66-dry-MD40']);
    expect(searchFamilies('').length).toBe(FAMILIES.length + FILLED_GRADE_IDS.length);
    expect(searchFamilies('amorphous sulfone').map((f) => f.params.id)).toEqual(['PSU', 'PESU']);
    expect(searchFamilies('no such polymer')).toEqual([]);
  });
  it('finds a polyamide at a humidity, shows its wet Tg, and writes its block with the humidity', () => {
    const [f, ...rest] = searchFamilies('PA66 at 70 % RH');
    expect(rest).toEqual([]);
    expect(f?.params.id).toBe('PA66 at 70 % RH');
    expect(searchFamilies('PC at 50 % RH')).toEqual([]);
    if (!f) return;
    // Gordon-Taylor wet Tg (humidity.ts), well below the dry 60 degC; the block keeps the dry Tg_C and the humidity.
    expect(summarize(f).quantities[0]?.text).toMatch(/^-?\d+(\.\d)? degC/);
    expect(parseFloat(summarize(f).quantities[0]?.text ?? '')).toBeLessThan(20);
    const rows = blockRows(f);
    expect(rows.find((r) => r[0] === 'humidity_pct')?.[1]).toBe(70);
    expect(rows.find((r) => r[0] === 'Tg_C')?.[1]).toBe(60);
  });
  it('shows Tg, Tm and the 23 degC modulus with their sources', () => {
    const pc = summarize(getFamily('PC'));
    expect(pc.quantities.map((q) => q.text)).toEqual(['147 degC (145 to 150)', '-', '2350 MPa (2200 to 2500)']);
    expect(pc.quantities[0]?.source).toMatch(/Polymer Handbook/);
    expect(pc.quantities[2]?.source).toMatch(/common practice/);
  });
  it('writes the block PARAMS spills (header, field, value, unit, description), and it reads back to the same material', () => {
    for (const f of FAMILIES) {
      const block = blockRows(f);
      expect(block[0]).toEqual(['field', 'value', 'unit', 'description']);
      expect(block.slice(1).map((r) => r[0])).toEqual(ALL_KEYS);
      // One layout: the cells DERATE.PARAMS spills, with its empty slots as the sheet's empty cells.
      expect(block).toEqual(paramsBlock(f.params).map((r) => r.map((c) => c ?? '')));
      const cells = familyBlockPlan(f).build('Sheet1', { row: 0, col: 0 }).cells;
      expect(cells.map((r) => r.map((c) => c.value))).toEqual(block);
      const back = paramsFromBlock({ values: block, formulas: block }, 'Sheet1!A1:D30');
      // Fields the kind does not use are written empty; everything the model reads comes back unchanged.
      for (const spec of NUMERIC_FIELDS.filter((s) => s.kinds.includes(f.params.kind)))
        expect(back[spec.key], spec.key).toBe(f.params[spec.key]);
      for (const key of TEXT_FIELDS) expect(back[key]).toBe(f.params[key]);
      const m0 = compileMaterial(f.params);
      const m1 = compileMaterial(back);
      for (const [t, T] of [
        [10, 296.15],
        [3.6e6, 353.15],
        [3.6e8, 423.15],
      ] as const) {
        expectClose(modulusMPa(m1, t, T), modulusMPa(m0, t, T), {
          rel: 1e-12,
          source: 'round trip through the parameter block (identity)',
        });
      }
    }
  });
  it('reads blocks as the material arguments do: no header, any case, two columns', () => {
    const two = parameterRows(getFamily('PC')).map(([k, v]) => [k.toUpperCase(), v]);
    expect(paramsFromBlock({ values: two, formulas: two }, 'A1:B29').Tg_C).toBe(147);
  });
  it('names the range and the field when a block in the sheet is wrong', () => {
    const rows = parameterRows(getFamily('PC')).map(([k, v]) => [k, k === 'Tg_C' ? 'hot' : v] as [string, string | number]);
    expect(() => paramsFromBlock({ values: rows, formulas: rows }, 'Sheet1!A1:B29')).toThrow(
      /Sheet1!A1:B29: parameter Tg_C: must be a number/,
    );
  });
});

describe('review inputs', () => {
  it('reads temperature lists with units, sorted and without duplicates', () => {
    expect(parseTemperatureList('80, 23; 176 degF, 353.15 K')).toEqual([23, 80]);
    expect(() => parseTemperatureList(' , ')).toThrow(InputError);
    expect(() => parseTemperatureList('-300')).toThrow(/absolute zero/);
  });
  it('keeps the service time as typed and the required modulus in MPa', () => {
    expect(parseServiceTime('1000')).toBe(1000);
    expect(parseServiceTime('5 y')).toBe('5 y');
    expect(() => parseServiceTime('5 kg')).toThrow(/service time/);
    expectClose(parseRequired('1 GPa'), 1000, { rel: 1e-12, source: 'SI prefix: 1 GPa = 1000 MPa' });
    expectClose(parseRequired('100 ksi'), 689.4757293168, { rel: 1e-12, source: 'NIST SP 811 (2008) B.8: 1 psi = 6894.757293168 Pa' });
  });
});

const INPUT: ReviewInput = {
  candidates: [
    { kind: 'family', id: 'PC' },
    {
      kind: 'block',
      range: { sheet: 'My grades', box: { top: 0, left: 3, bottom: 28, right: 4 } },
      params: { ...getFamily('PBT').params, id: 'PBT-mine' },
    },
  ],
  temperaturesC: [23, 80],
  load: { kind: 'time', time: 2000 },
  requiredMPa: 500,
};

describe('review plan', () => {
  const plan = reviewPlan(INPUT);
  const { cells, chart } = plan.build('Review 1', { row: 2, col: 1 });
  const at = (r: number, c: number) => cells[r]?.[c];

  it('writes live formulas that point at the input cells, placed where the block lands', () => {
    expect(at(2, 0)?.value).toBe('Service time, h');
    expect(at(2, 1)?.value).toBe(2000);
    expect(at(5, 0)?.value).toBe('Material');
    expect(at(6, 1)?.formula).toBe('=DERATE.MODULUS($B9,C$8,$C$5)');
    expect(at(7, 2)?.formula).toBe("=DERATE.MODULUS('My grades'!$D$1:$E$29,D$8,$C$5)");
    expect(at(7, 0)?.value).toBe("PBT-mine ('My grades'!D1:E29)");
    expect(at(6, 3)?.formula).toBe('=MIN(C9:D9)');
    expect(at(6, 4)?.formula).toBe('=IF(E9>=$C$4,"pass","fail")');
    expect(at(8, 1)?.formula).toBe('=$C$4');
  });

  it('shows the values the engine gives', () => {
    const t = parseTimeS(2000);
    const pc = compileMaterial(getFamily('PC').params);
    expectClose(Number(at(6, 2)?.value), modulusMPa(pc, t, cToKelvin(80)), { rel: 1e-12, source: ENGINE });
    expectClose(Number(at(6, 3)?.value), Math.min(modulusMPa(pc, t, cToKelvin(23)), modulusMPa(pc, t, cToKelvin(80))), {
      rel: 1e-12,
      source: 'minimum of the row (closed form)',
    });
  });

  it('writes the cautions and assumptions', () => {
    const text = cells.map((r) => String(r[0]?.value)).join('\n');
    expect(text).toMatch(/Assumptions/);
    expect(text).toMatch(/Parameter blocks are read live/);
    expect(text).toMatch(/licensed engineering review/);
  });

  it("charts each candidate's curve from its data column, the service points, MAXTEMP and the required line", () => {
    expect(chart?.series.map((s) => [s.name, s.draw])).toEqual([
      ['PC', 'curve'],
      ["PBT-mine ('My grades'!D1:E29)", 'curve'],
      ['At the service temperatures', 'points'],
      ['MAXTEMP (required met up to)', 'limits'],
      ['Required 500 MPa', 'reference'],
    ]);
    const L = reviewLayout(INPUT);
    const D = 2 + L.dataHeaderRow + 1;
    const column = (c: number, top: number, n: number) => ({
      sheet: 'Review 1',
      box: { top, left: 1 + c, bottom: top + n - 1, right: 1 + c },
    });
    expect(chart?.series[0]?.x).toEqual(column(0, D, CURVE_SAMPLES));
    expect(chart?.series[1]?.y).toEqual(column(2, D, CURVE_SAMPLES));
    expect(chart?.series[2]?.x).toEqual(column(5, D, 4));
    expect(chart?.series[3]?.x).toEqual(column(2, 2 + L.limitsHeaderRow + 1, 2));
    expect(chart?.series[4]?.y).toEqual(column(3, D, CURVE_SAMPLES));
    expect(chart?.logY).toBe(true);
    expect(chart?.place.left).toBeGreaterThan(1 + plan.cols);
  });

  it('writes the curves as DERATE.MODULUS cells over evenly spaced temperatures, as DERATE.CURVE spaces them', () => {
    const L = reviewLayout(INPUT);
    const D = L.dataHeaderRow;
    expect(at(D, 1)?.value).toBe('PC');
    expect(at(D + 1, 1)?.formula).toBe(`=DERATE.MODULUS($B$9,$B${D + 4},$C$5)`);
    expect(at(D + 2, 2)?.formula).toBe(`=DERATE.MODULUS('My grades'!$D$1:$E$29,$B${D + 5},$C$5)`);
    const temps = Array.from({ length: CURVE_SAMPLES }, (_, i) => Number(at(D + 1 + i, 0)?.value));
    // functions/tables.ts CURVE: T_i = from + (to - from) i / (n - 1).
    const curve = CURVE.invoke([['PC']], temps[0], temps[CURVE_SAMPLES - 1], CURVE_SAMPLES, 2000) as unknown[][];
    curve.slice(1).forEach((row, i) => {
      expectClose(temps[i] ?? NaN, Number(row[0]), { abs: 1e-6, source: 'DERATE.CURVE temperatures (functions/tables.ts)' });
      expectClose(Number(at(D + 1 + i, 1)?.value), Number(row[1]), { rel: 1e-9, source: 'DERATE.CURVE moduli (functions/tables.ts)' });
    });
    // The service points repeat the table's own cells: PC at 23 degC is C8 (header) and C9 (its row).
    expect(at(D + 1, 5)?.formula).toBe('=$C$8');
    expect(at(D + 1, 6)?.formula).toBe('=$C$9');
  });

  it('gives each candidate the MAXTEMP the worksheet function gives, and marks it only inside the drawn span', () => {
    const L = reviewLayout(INPUT);
    const M = L.limitsHeaderRow;
    expect(at(M + 1, 1)?.formula).toBe('=DERATE.MAXTEMP($B$9,$C$4,$C$5)');
    const pc = MAXTEMP.invoke([['PC']], 500, 2000);
    expect(typeof pc).toBe('number');
    expectClose(Number(at(M + 1, 1)?.value), Number(pc), { rel: 1e-9, source: 'DERATE.MAXTEMP (functions/limits.ts)' });
    const lo = Number(at(L.dataHeaderRow + 1, 0)?.value);
    const hi = Number(at(L.dataHeaderRow + CURVE_SAMPLES, 0)?.value);
    expect(lo).toBeLessThanOrEqual(23);
    expect(hi).toBeGreaterThanOrEqual(80);
    const shown = chart?.series[3]?.xValues ?? [];
    for (const t of shown) expect(t >= lo && t <= hi).toBe(true);
    expect(at(M + 1, 2)?.formula).toMatch(/^=IF\(ISNUMBER\(C\d+\),IF\(AND\(C\d+>=\$B\$\d+,C\d+<=\$B\$\d+\),C\d+,NA\(\)\),NA\(\)\)$/);
  });

  it('widens the span to a MAXTEMP just past the hottest service temperature, not to one far beyond it', () => {
    // PC at 800 MPa after 1000 h: MAXTEMP about 114 degC (issue 14), past the hottest listed 100 degC.
    expect(chartSpanC([23, 40, 60, 80, 100], [113.7])).toEqual([20, 115]);
    expect(chartSpanC([23, 40, 60, 80, 100], [400])).toEqual([20, 105]);
    expect(chartSpanC([60], [null])).toEqual([45, 75]);
  });

  it('refuses bad input before writing, naming it', () => {
    expect(() => reviewPlan({ ...INPUT, candidates: [] })).toThrow(/candidates/);
    expect(() => reviewPlan({ ...INPUT, load: { kind: 'cycle', steps: [{ temperatureC: 70, hours: -1 }], cycles: 10 } })).toThrow(
      /duty cycle step 1 hours/,
    );
    expect(() => reviewPlan({ ...INPUT, candidates: [{ kind: 'family', id: 'PX' }] })).toThrow(/candidate PX: unknown family/);
  });
});

describe('duty cycle', () => {
  it('a cycle spent wholly at the column temperature equals that time held constant', () => {
    const m = compileMaterial(getFamily('PBT').params);
    const cycle = reviewModulus(m, 60, { kind: 'cycle', steps: [{ temperatureC: 60, hours: 10 }], cycles: 100 });
    expectClose(cycle, modulusMPa(m, 1000 * 3600, cToKelvin(60)), {
      rel: 1e-12,
      source: 't_eq = N sum(dt_i a_T(Tref)/a_T(T_i)) reduces to N dt when T_i = Tref (closed form)',
    });
  });
  it('is no stiffer than holding the hottest step for the whole time, nor softer than the coolest (monotone model)', () => {
    const m = compileMaterial(getFamily('PC').params);
    const steps = [
      { temperatureC: 120, hours: 8 },
      { temperatureC: 30, hours: 16 },
    ];
    const at120 = reviewModulus(m, 120, { kind: 'cycle', steps, cycles: 365 });
    expect(at120).toBeGreaterThanOrEqual(modulusMPa(m, 365 * 24 * 3600, cToKelvin(120)) * (1 - 1e-12));
    expect(at120).toBeLessThanOrEqual(modulusMPa(m, 365 * 8 * 3600, cToKelvin(120)) * (1 + 1e-12));
  });
});

describe('chart axis and number display', () => {
  it('starts the log axis at a power of ten, at most four decades below the requirement', () => {
    expect(logAxisMinimum([2000, 450], 800)).toBe(100);
    expect(logAxisMinimum([1e-20, 2000], 800)).toBe(0.01);
    expect(logAxisMinimum([5000], 800)).toBe(100);
  });
  it('formats moduli like the Excel number format it writes', () => {
    expect([1877.8, 99.94, 1.5, 0.0123, 0].map(formatModulus)).toEqual(['1878', '99.9', '1.5', '1.23E-02', '0.00E+00']);
  });
});
