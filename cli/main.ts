/**
 * The `resin-derate` command line: the engine's answers as text tables or JSON. Over 400 lines because it
 * is the command table: one entry per command (options, usage, run), each short.
 */
import {
  displayedParams,
  KELVIN_OFFSET,
  apparentTg,
  bandEstimate,
  checkHistory,
  checkTemperatureInDomain,
  cyclesInput,
  retainedStressMPa,
  deratingTable,
  durationText,
  equivalentTimeS,
  familiesAndGrades,
  listedModulusMPa,
  familyInput,
  hdtStressInput,
  hottestK,
  InputError,
  isPronySpec,
  listInput,
  pronyToRecord,
  pronyToTable,
  ratioText,
  kelvinToC,
  maxTemperatureK,
  maxTimeS,
  modulusAfterHistory,
  modulusInput,
  modulusRangeText,
  modulusText,
  mpaValue,
  paramsToRecord,
  resolveMaterial,
  segmentsInput,
  shiftLog10,
  significant,
  simulateHdt,
  strainInput,
  stressText,
  temperatureInput,
  temperatureText,
  temperatureValue,
  timeInput,
  type InverseAnswer,
  type Material,
} from '../src/index.js';
import { csvTable, markdownTable } from './format.js';
import { runDemo } from './demo.js';
import { DEMO_WORKBOOK_PATH, writeDemoWorkbook } from './workbook.js';
import { CALIBRATION_COMMANDS } from './calibration.js';
import { emit, json, material, materialInputFrom, maybe, need, opt, type Command, type Out, type Values } from './command.js';
import { readArgs } from './args.js';
import { checkWritable, writingTo } from './files.js';
import { describeFault, EXIT, failure, oneLine } from './failure.js';
// The version printed by --version, taken from package.json when the bundle is built.
import pkg from '../package.json' with { type: 'json' };

export type { Out } from './command.js';

const CAUTION =
  'Screening estimates only: confirm with the supplier data and with creep or relaxation tests (ISO 899, ASTM D2990); apply the safety factors of the applicable code and defer to licensed engineering review for parts whose failure can hurt someone.';

function materialFrom(v: Values): Material {
  return resolveMaterial(materialInputFrom(v));
}

function inverseText(a: InverseAnswer, above: string, below: string): string {
  return a.status === 'above-throughout' ? above : below;
}

const COMMANDS: Record<string, Command> = {
  families: {
    summary: 'list the bundled polymer families and common filled grades',
    usage: 'resin-derate families [--json]',
    options: { ...json },
    run(v, out) {
      // A humid polyamide lists its wet Tg and modulus (`params` prints the dry ones and the humidity); each is computed once.
      const listed = familiesAndGrades();
      const data = listed.map((f) => ({
        id: f.params.id,
        name: f.params.name,
        kind: f.params.kind,
        Tg_C: displayedParams(f.params).Tg_C,
        Tm_C: f.params.Tm_C,
        E23_MPa: listedModulusMPa(f),
        sources: f.sources,
      }));
      const rows = data.map((d, i) => [
        d.id,
        d.kind,
        String(d.Tg_C),
        d.Tm_C === null ? '' : String(d.Tm_C),
        d.E23_MPa === null ? '' : listed[i]?.params.filler === 'none' ? String(d.E23_MPa) : significant(d.E23_MPa, 2),
        d.name,
      ]);
      emit(out, v, data, markdownTable(['id', 'kind', 'Tg degC', 'Tm degC', 'E23 MPa', 'name'], rows));
    },
  },
  params: {
    summary: 'print the full parameter record of a family (edit it and pass it back with --params)',
    usage: 'resin-derate params --family ID [--json]',
    options: { ...material, ...json },
    run(v, out) {
      const input = materialInputFrom(v);
      if (isPronySpec(input)) {
        const rows = pronyToTable(input);
        emit(out, v, pronyToRecord(input), rows.map((r) => r.map((c) => String(c)).join('\t')).join('\n') + '\n');
        return;
      }
      const m = resolveMaterial(input);
      const rec = paramsToRecord(m.params);
      const text = Object.entries(rec)
        .map(([k, x]) => `${k.padEnd(18)} ${x === null ? '' : String(x)}`)
        .join('\n');
      emit(out, v, rec, text + '\n');
    },
  },
  modulus: {
    summary: 'relaxation modulus at a temperature and time, with its region and band',
    usage: "resin-derate modulus --family ID --temp '80 degC' --time '1000 h' [--json]",
    options: { ...material, temp: { type: 'string' }, time: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const TK = checkTemperatureInDomain(m, need(v, 'temp', temperatureInput), '--temp');
      const tS = need(v, 'time', timeInput);
      const b = bandEstimate(m, tS, TK);
      const data = {
        modulus_MPa: b.centralMPa,
        region: b.region,
        low_MPa: b.lowMPa,
        high_MPa: b.highMPa,
        temperature_C: kelvinToC(TK),
        time_s: tS,
      };
      emit(out, v, data, `${m.params.id}: ${modulusText(b.centralMPa)} (${b.region}; band ${modulusRangeText(b.lowMPa, b.highMPa)})\n`);
    },
  },
  shift: {
    summary: 'log10 of the shift factor a_T relative to the family Tg',
    usage: "resin-derate shift --family ID --temp '120 degC' [--json]",
    options: { ...material, temp: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const TK = checkTemperatureInDomain(m, need(v, 'temp', temperatureInput), '--temp');
      const log10aT = shiftLog10(m.shift, TK);
      const law = m.shift.law === 'hybrid' ? (TK < m.shift.TrefK ? 'arrhenius' : 'wlf') : m.shift.law;
      emit(
        out,
        v,
        { log10_aT: log10aT, law },
        `log10 aT = ${significant(log10aT, 4)} (${law}, reference Tg = ${temperatureText(m.shift.TrefK - KELVIN_OFFSET)})\n`,
      );
    },
  },
  maxtemp: {
    summary: 'highest temperature at which the modulus stays at or above a required value for a time',
    usage: "resin-derate maxtemp --family ID --modulus '800 MPa' --time '1000 h' [--json]",
    options: { ...material, modulus: { type: 'string' }, time: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const req = need(v, 'modulus', modulusInput);
      const tS = need(v, 'time', timeInput);
      const a = maxTemperatureK(m, req, tS);
      const T = a.value === null || a.status === 'below-between' ? null : kelvinToC(a.value);
      const below = a.below?.map((K) => temperatureValue(kelvinToC(K)));
      const note =
        a.status === 'below-between'
          ? `below the required modulus from ${below?.[0]} to ${below?.[1]} degC only (the network stiffens as it warms)`
          : inverseText(a, 'stays above the required modulus up to 500 degC', 'below the required modulus even at -150 degC');
      emit(
        out,
        v,
        { temperature_C: T, status: a.status, ...(T === null ? { not_reached: note } : {}) },
        T === null ? `${note}\n` : `${temperatureText(T)}\n`,
      );
    },
  },
  maxtime: {
    summary: 'longest time for which the modulus stays at or above a required value at a temperature',
    usage: "resin-derate maxtime --family ID --modulus '800 MPa' --temp '80 degC' [--json]",
    options: { ...material, modulus: { type: 'string' }, temp: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const req = need(v, 'modulus', modulusInput);
      const TK = checkTemperatureInDomain(m, need(v, 'temp', temperatureInput), '--temp');
      const a = maxTimeS(m, req, TK);
      const note = inverseText(a, 'beyond 100 years', 'never reached: below the required modulus already at 1 ms');
      emit(
        out,
        v,
        {
          time_s: a.value,
          time_h: a.value === null ? null : a.value / 3600,
          status: a.status,
          ...(a.value === null ? { not_reached: note } : {}),
        },
        a.value === null ? `${note}\n` : `${durationText(a.value)}\n`,
      );
    },
  },
  tgat: {
    summary: 'apparent Tg at a time scale (the temperature where the glass-transition time equals it)',
    usage: "resin-derate tgat --family ID --time '1000 h' [--json]",
    options: { ...material, time: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const tS = need(v, 'time', timeInput);
      const a = apparentTg(m, tS);
      const T = a.valueK === null ? null : kelvinToC(a.valueK);
      const outside = `outside the model's range (${a.status === 'above-range' ? 'above 500' : 'below -150'} degC)\n`;
      emit(out, v, { temperature_C: T, status: a.status }, T === null ? outside : `${temperatureText(T)}\n`);
    },
  },
  eqtime: {
    summary: 'equivalent time of a repeated duty cycle at a reference temperature, and the modulus after it',
    usage: "resin-derate eqtime --family ID --cycle '70 degC:8 h,30 degC:16 h' --cycles 3650 [--ref '70 degC'] [--json]",
    options: { ...material, cycle: { type: 'string' }, cycles: { type: 'string' }, ref: { type: 'string' }, ...json },
    names: { temperature: '--cycle', temperatures: '--cycle', durations: '--cycle' },
    run(v, out) {
      const m = materialFrom(v);
      const segments = need(v, 'cycle', segmentsInput);
      for (const s of segments) checkTemperatureInDomain(m, s.TK, '--cycle');
      const cycles = maybe(v, 'cycles', cyclesInput) ?? 1;
      checkHistory(segments, cycles, { cycles: '--cycles', durations: '--cycle' });
      const ref = maybe(v, 'ref', temperatureInput);
      const refK = ref === undefined ? undefined : checkTemperatureInDomain(m, ref, '--ref');
      const teq = equivalentTimeS(m, segments, refK, cycles);
      const after = modulusAfterHistory(m, segments, cycles, refK);
      const refC = kelvinToC(refK ?? hottestK(segments));
      emit(
        out,
        v,
        {
          equivalent_time_s: teq,
          equivalent_time_h: teq / 3600,
          ref_temperature_C: refC,
          modulus_MPa: after.modulusMPa,
          region: after.region,
        },
        `${durationText(teq)} at ${temperatureText(refC)}; modulus after the history ${modulusText(after.modulusMPa)} (${after.region})\n`,
      );
    },
  },
  stress: {
    summary: 'stress retained at a fixed strain (press-fit, snap held closed) after a time at a temperature',
    usage: "resin-derate stress --family ID --strain '0.5 %' --temp '80 degC' --time '1000 h' [--json]",
    options: { ...material, strain: { type: 'string' }, temp: { type: 'string' }, time: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const strain = need(v, 'strain', strainInput);
      const TK = checkTemperatureInDomain(m, need(v, 'temp', temperatureInput), '--temp');
      const tS = need(v, 'time', timeInput);
      const r = retainedStressMPa(m, strain, tS, TK);
      const warn = r.beyondLinearRange ? ' (strain above about 1 %: beyond the usual linear range, estimate likely high)' : '';
      emit(
        out,
        v,
        { stress_MPa: r.stressMPa, modulus_MPa: r.modulusMPa, region: r.region, strain, beyond_linear_range: r.beyondLinearRange },
        `${stressText(r.stressMPa)} retained (modulus ${modulusText(r.modulusMPa)}, ${r.region})${warn}\n`,
      );
    },
  },
  hdt: {
    summary: 'simulated ISO 75 heat deflection temperature at a flexural stress (A 1.80, B 0.45, C 8.00 MPa)',
    usage: 'resin-derate hdt --family ID --stress A|B|C|1.8 [--json]',
    options: { ...material, stress: { type: 'string' }, ...json },
    run(v, out) {
      const m = materialFrom(v);
      const stress = need(v, 'stress', hdtStressInput);
      const r = simulateHdt(m, stress);
      const none =
        r.status === 'rubbery-throughout'
          ? 'does not apply: rubbery over the whole range (23 to 500 degC), not heat-proof\n'
          : 'not reached below 500 degC\n';
      emit(
        out,
        v,
        { temperature_C: r.temperatureC, status: r.status },
        r.temperatureC === null ? none : `${temperatureText(r.temperatureC)}\n`,
      );
    },
  },
  table: {
    summary: 'derating table: modulus and ratio to 23 degC / 1 h for families at temperatures after a time',
    usage: "resin-derate table --families PC,PA66-cond --temps 23,60,80 --time '1000 h' [--format md|csv|json]",
    options: { families: { type: 'string' }, temps: { type: 'string' }, time: { type: 'string' }, format: { type: 'string' } },
    names: { reference: '--families', materials: '--families', temperature: '--temps', temperatures: '--temps' },
    run(v, out) {
      const ids = need(v, 'families', listInput(familyInput)).map((f) => f.params.id);
      // degC for the table, with the round-off of the kelvin round trip removed (1e-9 K), as DERATE.GRID does.
      const temps = need(v, 'temps', listInput(temperatureInput)).map((K) => Math.round(kelvinToC(K) * 1e9) / 1e9);
      const tS = need(v, 'time', timeInput);
      const format = (v['format'] as string | undefined) ?? 'md';
      if (!['md', 'csv', 'json'].includes(format)) throw new InputError('--format', `must be md, csv or json, got '${format}'`);
      const rows = deratingTable(ids, temps, tS);
      if (format === 'json') {
        const data = rows.map((r) => ({
          id: r.id,
          reference_MPa: r.referenceMPa,
          cells: r.cells.map((c) => ({ temperature_C: c.temperatureC, modulus_MPa: c.modulusMPa, ratio: c.ratio, region: c.region })),
        }));
        out.write(JSON.stringify({ time_s: tS, reference: { temperature_C: 23, time_s: 3600 }, rows: data }, null, 2) + '\n');
        return;
      }
      const header = [
        'family',
        ...temps.map((t) => `${temperatureValue(t)} degC MPa`),
        ...temps.map((t) => `ratio ${temperatureValue(t)}`),
      ];
      // CSV is read by spreadsheets, so its cells stay numbers (4 significant figures); markdown is read by people.
      const csvBody = rows.map((r) => [
        r.id,
        ...r.cells.map((c) => significant(c.modulusMPa, 4)),
        ...r.cells.map((c) => (c.ratio === null ? '' : significant(c.ratio, 4))),
      ]);
      const mdBody = rows.map((r) => [
        r.id,
        ...r.cells.map((c) => mpaValue(c.modulusMPa)),
        ...r.cells.map((c) => (c.ratio === null ? '-' : ratioText(c.ratio))),
      ]);
      out.write(format === 'csv' ? csvTable(header, csvBody) : markdownTable(header, mdBody) + `\n${CAUTION}\n`);
    },
  },
  ...CALIBRATION_COMMANDS,
  demo: {
    summary: 'run the bundled demo scenario (invented): print its derating review and write it as a workbook of DERATE formulas',
    usage: `resin-derate demo [--workbook ${DEMO_WORKBOOK_PATH}]`,
    options: { workbook: { type: 'string' } },
    async run(v, out) {
      // The default folder (demo/) is made when missing; a folder the user names must exist, as for --out.
      const asked = opt(v, 'workbook');
      if (asked !== undefined) checkWritable(asked, '--workbook', 'review.xlsx');
      else if (v['workbook'] !== undefined) throw new InputError('--workbook', 'needs a file name');
      const review = runDemo(out);
      const path = asked ?? DEMO_WORKBOOK_PATH;
      await writingTo(path, '--workbook', 'review.xlsx', () => writeDemoWorkbook(review, path, asked === undefined));
      out.write(`\nWrote ${path} (DERATE.* formulas with the values above cached; open it in Excel with the Resin Derate add-in).\n`);
    },
  },
};

/** The commands by name; a Map, so that 'constructor' or '__proto__' is no command. */
const COMMAND_TABLE: ReadonlyMap<string, Command> = new Map(Object.entries(COMMANDS));

/** The version of this build (package.json). */
export const VERSION: string = pkg.version;

function helpText(): string {
  const lines = [...COMMAND_TABLE].map(([name, c]) => `  ${name.padEnd(10)} ${c.summary}`);
  return `resin-derate ${VERSION}: screening estimates of polymer stiffness versus time and temperature\n\nUsage: resin-derate COMMAND [options]   (resin-derate COMMAND --help for its options; resin-derate --version)\n\n${lines.join('\n')}\n\nBare numbers: temperatures degC, times hours, moduli MPa; unit text such as '80 degC', '1000 h', '2.4 GPa' is accepted.\nA negative value follows its option as typed: --temp -40, or --temp=-40.\n--family ID is a symbol that 'resin-derate families' lists, or a polyamide at a humidity: --family 'PA66 at 70 % RH' (a bare PA6 or PA66 is 50 % RH).\n${CAUTION}\n`;
}

/**
 * Runs the CLI with the given arguments; returns the exit code (EXIT in failure.ts). Every failure,
 * including a fault of the program, is one line on `err`; main never throws.
 */
export async function main(argv: readonly string[], out: Out, err: Out): Promise<number> {
  try {
    return await dispatch(argv, out, err);
  } catch (e) {
    err.write(`resin-derate: ${oneLine(`internal error (please report): ${describeFault(e)}`)}\n`);
    return EXIT.internal;
  }
}

/** main() but for faults outside a command (a failing output stream, say), which main reports. */
async function dispatch(argv: readonly string[], out: Out, err: Out): Promise<number> {
  const [name, ...rest] = argv;
  if (name === '--help' || name === '-h' || name === 'help') {
    out.write(helpText());
    return EXIT.answer;
  }
  if (name === undefined) {
    out.write(helpText());
    err.write('resin-derate: a command is required; the commands are listed above\n');
    return EXIT.badInput;
  }
  if (name === '--version') {
    out.write(`resin-derate ${VERSION}\n`);
    return EXIT.answer;
  }
  const command = COMMAND_TABLE.get(name);
  if (command === undefined) {
    const hint = name.startsWith('-') ? ' (the command comes first, then its options)' : '';
    err.write(`resin-derate: unknown command '${oneLine(name, 60)}'; commands: ${[...COMMAND_TABLE.keys()].join(', ')}${hint}\n`);
    return EXIT.badInput;
  }
  let values: Values = {};
  try {
    const args = readArgs(rest, command.options, name);
    if (args.help) {
      out.write(`${command.summary}\n\nUsage: ${command.usage}\n`);
      return EXIT.answer;
    }
    values = args.values;
    await command.run(values, out);
    return EXIT.answer;
  } catch (e) {
    const f = failure(e, command, values);
    err.write(`resin-derate ${name}: ${oneLine(f.message)}\n`);
    return f.code;
  }
}
