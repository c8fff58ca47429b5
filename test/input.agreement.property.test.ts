/**
 * One input, three front-ends, one verdict. The same random text goes through the worksheet's argument
 * reader (the spec of a real function's argument), the CLI's option reader (cli/command.ts `need` /
 * `maybe`, in-process) and the pane's field reader (addin/review.ts, addin/calibrate-form.ts); all three
 * must answer, with the same number, or refuse, with the same words apart from the name the front-end
 * gives the input. Then whole commands: the worksheet function against the CLI command run through main()
 * in-process, answer against answer, error message against error message.
 *
 * Reference: the contract of issue 11 ("a number the worksheet refuses is refused everywhere, with the same
 * words"); the expected values are each other, so a front-end that checks differently fails here.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { maybe, need, type Values } from '../cli/command.js';
import { readCalibration, type CalibrationFields } from '../addin/jobs/calibrate/request.js';
import { checkCycle, parseRequired, parseServiceTime, parseTemperatureList } from '../addin/jobs/review/plan.js';
import { ArgumentProblem } from '../functions/core/errors.js';
import { SheetError } from '../functions/core/cells.js';
import type { ArgSpec } from '../functions/core/args/spec.js';
import type { FunctionDef } from '../functions/core/define.js';
import { CALIBRATE } from '../functions/calibrate.js';
import { DMAFIT } from '../functions/dmafit.js';
import { DUTY, EQTIME } from '../functions/dutycycle.js';
import { HDT } from '../functions/hdt.js';
import { MAXTIME } from '../functions/limits.js';
import { MODULUS, STRESS } from '../functions/modulus.js';
import { CURVE } from '../functions/tables.js';
import {
  cyclesInput,
  curvePointsInput,
  decimalNumber,
  frequencyInput,
  glassTransitionInput,
  hdtStressInput,
  hdtTemperatureInput,
  InputError,
  meltingInput,
  modulusInput,
  strainInput,
  temperatureInput,
  timeInput,
  type Quantity,
} from '../src/index.js';
import {
  anyText,
  mostlyValid,
  numberText,
  propertyParameters,
  SPACES,
  unitText,
  validStrainText,
  validStressText,
  validTemperatureText,
  validTimeText,
} from './arbitraries.js';
import { BLANK_CALIBRATION_FIELDS } from './support/calibration-form.js';
import { runMain } from './support/cli-run.js';

/** What a front-end made of one input: a number in engine units, nothing (left empty, optional), or a problem. */
type Verdict = { readonly ok: number | undefined } | { readonly problem: string };

/** Messages compared as one line (the CLI prints one line per error). */
function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, ' ');
}

function verdict(f: () => number | undefined): Verdict {
  try {
    return { ok: f() };
  } catch (e) {
    if (e instanceof ArgumentProblem || e instanceof InputError) return { problem: oneLine(e.problem) };
    throw e;
  }
}

/** A verdict without its number: answered, or the problem. */
function kind(v: Verdict): { ok: 'answer' } | { problem: string } {
  return 'problem' in v ? v : { ok: 'answer' };
}

function expectSame(label: string, a: Verdict, b: Verdict, rel = 1e-12): void {
  if ('problem' in a || 'problem' in b) {
    expect(b, label).toEqual(a);
    return;
  }
  if (a.ok === undefined || b.ok === undefined) {
    expect(b.ok, label).toBe(a.ok);
    return;
  }
  expect(Math.abs(b.ok - a.ok), `${label}: ${a.ok} vs ${b.ok}`).toBeLessThanOrEqual(rel * Math.abs(a.ok) + 1e-12);
}

function arg(def: FunctionDef, name: string): ArgSpec<unknown> {
  const a = def.args.find((x) => x.name === name);
  if (!a) throw new Error(`${def.id} has no argument ${name}`);
  return a;
}

/** The worksheet's reading of one cell holding `text`. */
function sheet(def: FunctionDef, name: string, text: string): Verdict {
  return verdict(() => arg(def, name).parse(text) as number | undefined);
}

/** The CLI's reading of `--key text` for a required (need) or optional (maybe) option. */
function cli(key: string, q: Quantity<number>, text: string, optional = false): Verdict {
  const v: Values = { [key]: text };
  return verdict(() => (optional ? maybe(v, key, q) : need(v, key, q)));
}

/** The pane's calibration form with one field typed. */
function form(fields: Partial<CalibrationFields>, pick: (r: ReturnType<typeof readCalibration>) => number | undefined): Verdict {
  return verdict(() => pick(readCalibration({ ...BLANK_CALIBRATION_FIELDS, ...fields })));
}

/** Text of a quantity: mostly valid, out-of-range numbers, unit text of the quantity and of others, anything. */
function raw(
  valid: fc.Arbitrary<string>,
  quantity: 'temperature' | 'time' | 'stress',
  outOfRange: fc.Arbitrary<number>,
): fc.Arbitrary<string> {
  const pad = fc.constantFrom(...SPACES);
  return fc.oneof(
    { weight: 4, arbitrary: mostlyValid(valid, quantity, 0.6) },
    { weight: 2, arbitrary: outOfRange.map((x) => String(x)) },
    { weight: 1, arbitrary: fc.tuple(pad, valid, pad).map((p) => p.join('')) },
    { weight: 1, arbitrary: unitText(quantity) },
    { weight: 1, arbitrary: anyText() },
  );
}

const temperatureText = raw(validTemperatureText(), 'temperature', fc.double({ min: -400, max: 2500, noNaN: true }));
const timeText = raw(
  validTimeText(),
  'time',
  fc.oneof(fc.double({ min: -10, max: 1e7, noNaN: true }), fc.constantFrom(1e-7, 876601, 1e300)),
);
const modulusText = raw(validStressText(), 'stress', fc.oneof(fc.double({ min: -10, max: 2e5, noNaN: true }), fc.constantFrom(1e5, 1e6)));
const notBlank = (t: string): boolean => t.trim() !== '';
/** The pane reads its temperature fields as lists (commas and semicolons separate items). */
const oneItem = (t: string): boolean => notBlank(t) && !/[,;]/.test(t);

const RUNS = 200;

describe('the same text through the worksheet, the CLI and the pane: the same verdict', () => {
  it('temperature: MODULUS(temperature), --temp, the service temperatures field, the creep temperature field', () => {
    fc.assert(
      fc.property(temperatureText, (t) => {
        const ws = sheet(MODULUS, 'temperature', t);
        expectSame(`--temp ${JSON.stringify(t)}`, ws, cli('temp', temperatureInput, t));
        if (!oneItem(t)) return;
        const pane = verdict(() => {
          const [C] = parseTemperatureList(t);
          return C === undefined ? undefined : C + 273.15;
        });
        // The pane rounds a service temperature to 1e-6 degC (its cells hold what the user reads).
        expectSame(`service temperatures ${JSON.stringify(t)}`, ws, pane, 1e-8);
        const creep = form({ creepModulus: '1800', creepTemperature: t }, (r) => r.inputs.moduli?.[0]?.temperatureK);
        expectSame(`creep temperature ${JSON.stringify(t)}`, ws, creep);
      }),
      propertyParameters(RUNS),
    );
  });

  it('time: MODULUS(time), --time, the service time field, the creep time field', () => {
    fc.assert(
      fc.property(timeText, (t) => {
        const ws = sheet(MODULUS, 'time', t);
        expectSame(`--time ${JSON.stringify(t)}`, ws, cli('time', timeInput, t));
        // The service time is kept as typed for its cell (no number to compare); its verdict and words must agree.
        expect(kind(verdict(() => (parseServiceTime(t), 0))), `service time ${JSON.stringify(t)}`).toEqual(kind(ws));
        if (!notBlank(t)) return;
        expectSame(
          `creep time ${JSON.stringify(t)}`,
          ws,
          form({ creepModulus: '1800', creepTime: t }, (r) => r.inputs.moduli?.[0]?.timeS),
        );
      }),
      propertyParameters(RUNS),
    );
  });

  it('modulus: MAXTIME(required_modulus), --modulus, the required stiffness field, the datasheet modulus fields', () => {
    fc.assert(
      fc.property(modulusText, (t) => {
        const ws = sheet(MAXTIME, 'required_modulus', t);
        expectSame(`--modulus ${JSON.stringify(t)}`, ws, cli('modulus', modulusInput, t));
        expectSame(
          `required modulus ${JSON.stringify(t)}`,
          ws,
          verdict(() => parseRequired(t)),
        );
        if (!notBlank(t)) return;
        expectSame(
          `modulus at 23 degC ${JSON.stringify(t)}`,
          ws,
          form({ modulus23: t }, (r) => r.inputs.modulus23MPa),
        );
        const creep = sheet(CALIBRATE, 'creep_modulus', t);
        expectSame(
          `creep modulus ${JSON.stringify(t)}`,
          creep,
          form({ creepModulus: t }, (r) => r.inputs.moduli?.[0]?.modulusMPa),
        );
      }),
      propertyParameters(RUNS),
    );
  });

  it('datasheet HDT and Tg: CALIBRATE(hdt_a, tg), --hdt-a and --tg, the HDT/A and Tg fields (left empty: not given)', () => {
    fc.assert(
      fc.property(temperatureText, (t) => {
        const hdt = sheet(CALIBRATE, 'hdt_a', t);
        expectSame(`--hdt-a ${JSON.stringify(t)}`, hdt, cli('hdt-a', hdtTemperatureInput, t, true));
        const tg = sheet(CALIBRATE, 'tg', t);
        expectSame(`--tg ${JSON.stringify(t)}`, tg, cli('tg', glassTransitionInput, t, true));
        expectSame(`--tm ${JSON.stringify(t)}`, sheet(CALIBRATE, 'tm', t), cli('tm', meltingInput, t, true));
        if (!notBlank(t)) return;
        expectSame(
          `HDT/A ${JSON.stringify(t)}`,
          hdt,
          form({ hdtA: t }, (r) => r.inputs.hdt?.[0]?.temperatureK),
        );
        expectSame(
          `Tg ${JSON.stringify(t)}`,
          tg,
          form({ tg: t }, (r) => r.inputs.TgK),
        );
      }),
      propertyParameters(RUNS),
    );
  });

  it('cycles: DUTY(cycles), --cycles, and the pane (which reads its cycles field with Number(), so plain decimals only)', () => {
    const cyclesText = fc.oneof(
      fc.integer({ min: -5, max: 40_000 }).map(String),
      fc.constantFrom('0', '0.5', '1e7', '1.0000001e7', '1e300', '1e-300', '-1', '1e400', '0x10', ''),
      numberText(),
      anyText(),
    );
    fc.assert(
      fc.property(cyclesText, (t) => {
        const ws = sheet(DUTY, 'cycles', t);
        // Both optional: an empty cell takes the default 1, an empty --cycles is "not given" (1 in the command).
        const c = cli('cycles', cyclesInput, t, true);
        expectSame(`--cycles ${JSON.stringify(t)}`, ws, 'ok' in c && c.ok === undefined ? { ok: 1 } : c);
        const n = decimalNumber(t);
        if (n === undefined || !Number.isFinite(n)) return;
        // The pane's whole duty cycle (one step, 23 degC for 1 h) against DUTY with the same: the history's
        // length is checked too, so the verdict is that of the whole function. The pane hands the layer a
        // number, not the text, so its message quotes 0 where the worksheet quotes "0": verdicts only here.
        const pane = 'ok' in verdict(() => (checkCycle([{ temperatureC: 23, hours: 1 }], n), n));
        const out = DUTY.invoke('PC', 23, 1, t);
        expect(pane, `duty cycle of ${JSON.stringify(t)} cycles: ${out instanceof SheetError ? out.message : String(out)}`).toBe(
          !(out instanceof SheetError),
        );
      }),
      propertyParameters(RUNS),
    );
  });

  it('strain, HDT stress, points, frequency: the worksheet and the CLI (the pane has no such field)', () => {
    const cases: [FunctionDef, string, string, Quantity<number>, fc.Arbitrary<string>][] = [
      [
        STRESS,
        'strain',
        'strain',
        strainInput,
        fc.oneof(validStrainText(), numberText(), anyText(), fc.constantFrom('10 %', '10.1 %', '0x1', '5%')),
      ],
      [
        HDT,
        'stress',
        'stress',
        hdtStressInput,
        fc.oneof(validStressText(), fc.constantFrom('A', 'b', ' C ', 'D', '50', '51'), anyText('stress')),
      ],
      [CURVE, 'points', 'points', curvePointsInput, fc.oneof(fc.integer({ min: -3, max: 1200 }).map(String), numberText(), anyText())],
      [
        DMAFIT,
        'frequency_Hz',
        'frequency',
        frequencyInput,
        fc.oneof(fc.constantFrom('1 Hz', '10 mHz', '2 kHz', '1 MHz', '1e5'), numberText(), anyText()),
      ],
    ];
    for (const [def, name, key, q, text] of cases) {
      fc.assert(
        fc.property(text, (t) => expectSame(`${def.id}(${name}) / --${key} ${JSON.stringify(t)}`, sheet(def, name, t), cli(key, q, t))),
        propertyParameters(RUNS),
      );
    }
  });
});

// ---------------------------------------------------------------------------------------------
// Whole commands: worksheet function against CLI command (main() in-process)
// ---------------------------------------------------------------------------------------------

interface CliAnswer {
  readonly code: number;
  readonly json: Record<string, unknown> | null;
  /** The message after "resin-derate COMMAND: OPTION: ". */
  readonly problem: string | null;
  readonly option: string | null;
}

async function runCli(args: readonly string[]): Promise<CliAnswer> {
  const { code, out, err } = await runMain(args);
  if (code === 0) return { code, json: JSON.parse(out) as Record<string, unknown>, problem: null, option: null };
  const m = /^resin-derate [a-z]+: (--[a-z0-9-]+): (.*)\n$/s.exec(err);
  return { code, json: null, problem: m?.[2] ?? err, option: m?.[1] ?? null };
}

/** Checks a worksheet result against the CLI's: the same number, or the same words after the name. */
function agree(label: string, ws: unknown, c: CliAnswer, key: string, names: Readonly<Record<string, string>>): void {
  if (ws instanceof SheetError) {
    expect(c.code, `${label}: the worksheet refuses (${ws.message}), the CLI answers`).not.toBe(0);
    const m = /^([a-z_]+): (.*)$/s.exec(ws.message);
    expect(m, `${label}: ${ws.message}`).not.toBeNull();
    expect(c.option, label).toBe(names[m?.[1] ?? '']);
    // The CLI prints every failure on one line, so a tab, newline or other control character the user typed shows as a space there.
    const plain = (t: string): string => t.replace(/[\s\u0000-\u001f\u007f]/g, ' ');
    expect(plain(c.problem ?? ''), label).toBe(plain(oneLine(m?.[2] ?? '')));
    return;
  }
  expect(c.code, `${label}: the worksheet answers ${String(ws)}, the CLI says ${c.problem}`).toBe(0);
  const x = c.json?.[key];
  expect(typeof x, label).toBe('number');
  expect(Math.abs((x as number) - (ws as number)), `${label}: ${String(ws)} vs ${String(x)}`).toBeLessThanOrEqual(
    1e-12 * Math.abs(ws as number),
  );
}

describe('whole commands agree with the worksheet functions', () => {
  it('MODULUS(PC, temperature, time) and modulus --family PC --temp --time', async () => {
    await fc.assert(
      fc.asyncProperty(temperatureText, timeText, async (T, t) => {
        const ws = MODULUS.invoke('PC', T, t);
        const c = await runCli(['modulus', '--family', 'PC', `--temp=${T}`, `--time=${t}`, '--json']);
        agree(`MODULUS ${JSON.stringify([T, t])}`, ws, c, 'modulus_MPa', { temperature: '--temp', time: '--time' });
      }),
      propertyParameters(150),
    );
  });

  it('STRESS(PBT, strain, 60, "1000 h") and stress --strain', async () => {
    const strainText = fc.oneof(validStrainText(), numberText(), anyText(), fc.constantFrom('10 %', '12 %', '0.5%'));
    await fc.assert(
      fc.asyncProperty(strainText, async (e) => {
        const ws = STRESS.invoke('PBT', e, 60, '1000 h');
        const c = await runCli(['stress', '--family', 'PBT', `--strain=${e}`, '--temp', '60', '--time', '1000 h', '--json']);
        agree(`STRESS ${JSON.stringify(e)}`, ws, c, 'stress_MPa', { strain: '--strain' });
      }),
      propertyParameters(100),
    );
  });

  it('EQTIME(PBT, {70; 30}, {8; 16}, , cycles) and eqtime --cycle --cycles', async () => {
    const cyclesText = fc.oneof(
      fc.integer({ min: -2, max: 40_000 }).map(String),
      fc.constantFrom('1e300', '1e7', '0.5', '0x10'),
      numberText(),
    );
    await fc.assert(
      fc.asyncProperty(cyclesText, async (n) => {
        const ws = EQTIME.invoke('PBT', [[70], [30]], [[8], [16]], null, n);
        const c = await runCli(['eqtime', '--family', 'PBT', '--cycle', '70:8,30:16', `--cycles=${n}`, '--json']);
        // An empty --cycles is "not given" (1 cycle), as an empty optional cell is.
        agree(`EQTIME cycles ${JSON.stringify(n)}`, ws, c, 'equivalent_time_h', { cycles: '--cycles', durations: '--cycle' });
      }),
      propertyParameters(100),
    );
  });

  it('HDT(PA66-dry, stress) and hdt --stress, letters A, B, C included', async () => {
    for (const s of ['A', 'b', 'C', '0.45 MPa', '1e5', 'D', '60', '0']) {
      const ws = HDT.invoke('PA66-dry', s);
      const c = await runCli(['hdt', '--family', 'PA66-dry', `--stress=${s}`, '--json']);
      if (ws instanceof SheetError && ws.code === '#N/A') {
        expect(c.code, `hdt ${s}`).toBe(0);
        expect(c.json?.['temperature_C'], `hdt ${s}: not reached`).toBeNull();
        continue;
      }
      agree(`HDT ${s}`, ws, c, 'temperature_C', { stress: '--stress' });
    }
  });
});

describe('the examples of issue 11 are refused by the CLI as by the worksheet', () => {
  const cases: [string[], RegExp][] = [
    [['modulus', '--family', 'PC', '--temp', '600', '--time', '1 h'], /^--temp: "600" is outside the model's range -150 to 500 degC$/],
    [
      ['modulus', '--family', 'PC', '--temp', '80', '--time', '1000 years'],
      /^--time: "1000 years" is outside the model's range 1 ms to 100 years$/,
    ],
    [['modulus', '--family', 'PC', '--temp', '80', '--time', '1 ns'], /^--time: "1 ns" is outside the model's range/],
    [['maxtime', '--family', 'PC', '--modulus', '1e5 GPa', '--temp', '80'], /^--modulus: "1e5 GPa" is above 100000 MPa$/],
    [['hdt', '--family', 'PC', '--stress', '1e5'], /^--stress: 100000 is above 50 MPa$|^--stress: "1e5" is above 50 MPa$/],
    [['eqtime', '--family', 'PC', '--cycle', '80:8', '--cycles', '1e300'], /^--cycles: expects a number of repeats from 1 to 10000000/],
    [['calibrate', '--family', 'PC', '--hdt-a', '10'], /^--hdt-a: must be above 23 degC, where the ISO 75 test starts; got 10$/],
    [
      ['calibrate', '--family', 'PC', '--hdt-a', '150', '--hdt-b', '120'],
      /^--hdt-a: 150 is above HDT\/B \(120\); the higher stress of method A/,
    ],
  ];
  for (const [args, message] of cases) {
    it(args.join(' '), async () => {
      const c = await runCli(args);
      expect(c.code).not.toBe(0);
      expect(`${c.option}: ${c.problem}`).toMatch(message);
    });
  }
  it('and the worksheet says the same after its own argument names (time "1000 years", hdt_a 10, hdt_a above hdt_b)', () => {
    expect((MODULUS.invoke('PC', 80, '1000 years') as SheetError).message).toBe(
      `time: "1000 years" is outside the model's range 1 ms to 100 years`,
    );
    expect((CALIBRATE.invoke('PC', null, 10) as SheetError).message).toBe(
      'hdt_a: must be above 23 degC, where the ISO 75 test starts; got 10',
    );
    expect((CALIBRATE.invoke('PC', null, 150, 120) as SheetError).message).toMatch(
      /^hdt_a: 150 is above HDT\/B \(120\); the higher stress of method A/,
    );
    expect(HDT.invoke('PC', 'A')).toEqual(HDT.invoke('PC', 1.8));
  });
});
