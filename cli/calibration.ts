/**
 * CLI commands for calibration and the user's own test data: calibrate (datasheet points), fit
 * (relaxation or creep curves -> master curve, shift law, Prony table), dmafit (DMA sweep -> parameters)
 * and creepmod (apparent creep modulus). Registered into the command table of main.ts. Over 400 lines
 * because it is the command table of these four commands, each entry short.
 */
import {
  atItem,
  calibrateDatasheet,
  calibrationFittedRows,
  checkHdtOrder,
  checkMelting,
  checkTemperatureInDomain,
  creepModulusMPa,
  fitCurves,
  fitDma,
  FITTED_HEADER,
  frequencyInput,
  getGrade,
  glassTransitionInput,
  HDT_METHODS,
  hdtStressInput,
  hdtTemperatureInput,
  InputError,
  isPronySpec,
  kelvinToC,
  localSlope,
  meltingInput,
  modulusInput,
  modulusMPa,
  modulusText,
  NUMERIC_FIELDS,
  type NumericField,
  paramsToRecord,
  parseCsv,
  pronyToRecord,
  pronyToTable,
  readCurveTable,
  readDmaTable,
  resolveMaterial,
  significant,
  splitList,
  temperatureInput,
  temperatureText,
  temperatureValue,
  termsPerDecadeInput,
  timeInput,
  valueIn,
  type DatasheetInputs,
  type HdtPoint,
  type MaterialInput,
  type MaterialParams,
  type ModulusDatum,
} from '../src/index.js';
import { csvTable, markdownTable } from './format.js';
import { emit, json, material, materialInputFrom, maybe, need, opt, readText, str, type Command, type Values } from './command.js';
import { checkWritable, writeTextFile } from './files.js';
import { inventedDmaCsv, inventedRelaxationCsv } from './demodata.js';

const CAUTION =
  'Screening estimates only: a calibrated or fitted record reproduces the numbers it was given, not the part. Confirm with the supplier data and with creep or relaxation tests (ISO 899, ASTM D2990); apply the safety factors of the applicable code and defer to licensed engineering review for parts whose failure can hurt someone.';

/** Refuses an --out path that cannot be written before a fit spends its time (files.ts). */
function checkOut(v: Values): void {
  const file = opt(v, 'out');
  if (file !== undefined) checkWritable(file, '--out');
  else if (v['out'] !== undefined) throw new InputError('--out', 'needs a file name');
}

function writeOut(v: Values, data: object): string {
  const file = opt(v, 'out');
  if (!file) return '';
  writeTextFile(file, JSON.stringify(data, null, 2) + '\n', '--out');
  return `Record written to ${file} (use it with --params ${file}).\n`;
}

const MODULUS_POINT = 'TIME@TEMPERATURE:MODULUS items such as "1000 h@23 degC:1900"';

const FIELD_NAMES: readonly string[] = NUMERIC_FIELDS.map((f) => f.key);

/** Table rows of fitted parameters (dmafit): field, start, fitted value, and whether it ended on a bound. */
function fittedRows(free: readonly { field: string; start: number; value: number; atBound: boolean }[]): string[][] {
  return free.map((f) => [f.field, significant(f.start, 4), significant(f.value, 4), f.atBound ? 'at bound' : '']);
}

/** --free: parameter names, each checked here so that a typo reads as one rather than as a fitting problem. */
function freeFields(text: string | undefined): NumericField[] | undefined {
  const names = list(text);
  for (const name of names) {
    if (!FIELD_NAMES.includes(name))
      throw new InputError('--free', `'${name}' is not a parameter name; the names are ${FIELD_NAMES.join(', ')}`);
  }
  // No names: the automatic choice of the fitting code.
  return names.length > 0 ? (names as NumericField[]) : undefined;
}

/** The datasheet options of calibrate, by the engine's name of the input each gives. */
const DATASHEET_OPTIONS = ['modulus23', 'hdt-a', 'hdt-b', 'hdt', 'tg', 'tm', 'creep', 'relax'] as const;

/** The options among `keys` that were given (all of them when none was), for a message about several inputs. */
function given(v: Values, keys: readonly string[]): string {
  const there = keys.filter((k) => opt(v, k) !== undefined);
  return (there.length > 0 ? there : keys).map((k) => `--${k}`).join(', ');
}

function list(text: string | undefined): string[] {
  return (text ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter((s) => s !== '');
}

/** 'TIME@TEMPERATURE:MODULUS' items, e.g. '1000 h@23 degC:1900'; each value read by the input layer. */
function modulusPoints(text: string | undefined, kind: ModulusDatum['kind'], argument: string): ModulusDatum[] {
  if (text === undefined) return [];
  const items = splitList(text, argument, MODULUS_POINT);
  return items.map((item, i) =>
    atItem(argument, 'item', i, items.length, () => {
      const m = /^(.+)@(.+):(.+)$/.exec(item);
      if (!m) throw new InputError(argument, `"${item}" must be TIME@TEMPERATURE:MODULUS, such as "1000 h@23 degC:1900"`);
      return {
        kind,
        timeS: timeInput.parse(m[1]!.trim(), argument),
        temperatureK: temperatureInput.parse(m[2]!.trim(), argument),
        modulusMPa: modulusInput.parse(m[3]!.trim(), argument),
      };
    }),
  );
}

const HDT_POINT = 'STRESS:TEMPERATURE items such as "8:95" (8 MPa, 95 degC) or "A:120"';

/** 'STRESS:TEMPERATURE' items, e.g. '8:95' or 'A:120'; the stress may be an ISO 75 method letter. */
function hdtPoints(text: string | undefined): HdtPoint[] {
  if (text === undefined) return [];
  const items = splitList(text, '--hdt', HDT_POINT);
  return items.map((item, i) =>
    atItem('--hdt', 'item', i, items.length, () => {
      const [s, t, extra] = item.split(':');
      if (s === undefined || t === undefined || extra !== undefined) {
        throw new InputError('--hdt', `"${item}" must be STRESS:TEMPERATURE, such as "8:95" (8 MPa, 95 degC)`);
      }
      return {
        stressMPa: hdtStressInput.parse(s.trim(), '--hdt'),
        temperatureK: hdtTemperatureInput.parse(t.trim(), '--hdt'),
        raw: t.trim(),
        name: '--hdt',
      };
    }),
  );
}

/** The parameter record a start names, for the checks that need it (none for a Prony material, which the engine refuses). */
function startParams(start: MaterialInput): MaterialParams | undefined {
  if (typeof start === 'string') return getGrade(start).params;
  return isPronySpec(start) ? undefined : start;
}

const NUM = (x: number | null): string => (x === null ? '' : significant(x, 4));

export const CALIBRATION_COMMANDS: Record<string, Command> = {
  calibrate: {
    summary: 'calibrate a family to datasheet numbers (modulus, HDT/A, HDT/B, Tg, Tm, creep moduli)',
    usage:
      "resin-derate calibrate --family ID [--modulus23 2400] [--hdt-a 132] [--hdt-b 142] [--hdt 'STRESS:TEMP,...'] [--tg 147] [--tm 223] [--creep '1000 h@23:1900'] [--relax 'TIME@TEMP:E'] [--free F1,F2] [--id NAME] [--out FILE.json] [--json]",
    options: {
      ...material,
      modulus23: { type: 'string' },
      'hdt-a': { type: 'string' },
      'hdt-b': { type: 'string' },
      hdt: { type: 'string' },
      tg: { type: 'string' },
      tm: { type: 'string' },
      creep: { type: 'string' },
      relax: { type: 'string' },
      free: { type: 'string' },
      id: { type: 'string' },
      out: { type: 'string' },
      ...json,
    },
    names: {
      start: '--params',
      modulus23: '--modulus23',
      Tg: '--tg',
      Tm: '--tm',
      hdt: (v) => given(v, ['hdt-a', 'hdt-b', 'hdt']),
      'hdt stress': '--hdt',
      'hdt temperature': (v) => given(v, ['hdt-a', 'hdt-b', 'hdt']),
      'creep time': '--creep',
      'creep temperature': '--creep',
      'creep modulus': '--creep',
      'relaxation time': '--relax',
      'relaxation temperature': '--relax',
      'relaxation modulus': '--relax',
      inputs: (v) => given(v, DATASHEET_OPTIONS),
    },
    run(v, out) {
      checkOut(v);
      const start = materialInputFrom(v);
      // The same checks as the worksheet's CALIBRATE and the pane's form (src/input/).
      const hdt: HdtPoint[] = [];
      const a = maybe(v, 'hdt-a', hdtTemperatureInput);
      const b = maybe(v, 'hdt-b', hdtTemperatureInput);
      if (a !== undefined) hdt.push({ stressMPa: HDT_METHODS.A, temperatureK: a, raw: opt(v, 'hdt-a') ?? '', name: '--hdt-a' });
      if (b !== undefined) hdt.push({ stressMPa: HDT_METHODS.B, temperatureK: b, raw: opt(v, 'hdt-b') ?? '', name: '--hdt-b' });
      hdt.push(...hdtPoints(opt(v, 'hdt')));
      checkHdtOrder(hdt);
      const TgK = maybe(v, 'tg', glassTransitionInput);
      const TmK = maybe(v, 'tm', meltingInput);
      const p0 = startParams(start);
      if (TmK !== undefined && p0) checkMelting(TmK, opt(v, 'tm') ?? '', TgK, p0, '--tm');
      const m23 = maybe(v, 'modulus23', modulusInput);
      const inputs: DatasheetInputs = {
        ...(m23 !== undefined ? { modulus23MPa: m23 } : {}),
        ...(TgK !== undefined ? { TgK } : {}),
        ...(TmK !== undefined ? { TmK } : {}),
        hdt: hdt.map((h) => ({ stressMPa: h.stressMPa, temperatureK: h.temperatureK })),
        moduli: [...modulusPoints(opt(v, 'creep'), 'creep', '--creep'), ...modulusPoints(opt(v, 'relax'), 'relaxation', '--relax')],
      };
      const free = freeFields(opt(v, 'free'));
      const id = opt(v, 'id');
      // Engine names of the inputs become options through this command's `names` table (cli/failure.ts).
      const r = calibrateDatasheet(start, inputs, { ...(free ? { free } : {}), ...(id ? { id } : {}) });
      const data = {
        params: paramsToRecord(r.params),
        free: r.free,
        family: r.family,
        residuals: r.residuals,
        iterations: r.iterations,
        converged: r.converged,
        reason: r.reason,
        quality: r.quality,
        notes: r.notes,
        caution: CAUTION,
      };
      const written = writeOut(v, data);
      const value = (x: number | null, unit: string): string => (x === null ? 'not reached' : valueIn(x, unit));
      const rows = r.residuals.map((x) => [
        x.input,
        value(x.given, x.unit),
        value(x.reproduced, x.unit),
        x.unit,
        x.tolerance,
        x.within ? 'yes' : 'NO',
        x.via,
      ]);
      const freeRows = calibrationFittedRows(r).map((row) => row.map((c) => (typeof c === 'number' ? significant(c, 4) : (c ?? ''))));
      const text =
        `Calibrated record '${r.params.id}' (quality ${r.quality}; ${r.iterations} iterations, ${r.reason})\n\n` +
        markdownTable(['input', 'given', 'reproduced', 'unit', 'tolerance', 'within', 'set through'], rows) +
        (freeRows.length > 0
          ? `\n${r.family === null ? 'Not a bundled family: no defaults to compare.\n' : `Family ${r.family} beside the fitted values:\n`}` +
            markdownTable([...FITTED_HEADER], freeRows)
          : '') +
        r.notes.map((n) => `\nnote: ${n}`).join('') +
        `\n\n${written}${CAUTION}\n`;
      emit(out, v, data, text);
    },
  },
  fit: {
    summary: 'fit relaxation or creep curves: master curve, WLF / Arrhenius shift law and Prony table',
    usage:
      'resin-derate fit --data FILE.csv [--tg 147] [--ref 160] [--terms-per-decade N] [--id NAME] [--format md|csv|json] [--json] [--out FILE.json]',
    options: {
      data: { type: 'string' },
      tg: { type: 'string' },
      ref: { type: 'string' },
      'terms-per-decade': { type: 'string' },
      id: { type: 'string' },
      format: { type: 'string' },
      out: { type: 'string' },
      ...json,
    },
    names: { reference: '--ref', termsPerDecade: '--terms-per-decade' },
    run(v, out) {
      checkOut(v);
      const file = str(v, 'data');
      const set = readCurveTable(parseCsv(readText(file, '--data')));
      const tg = maybe(v, 'tg', temperatureInput);
      const ref = maybe(v, 'ref', temperatureInput);
      const perDecade = maybe(v, 'terms-per-decade', termsPerDecadeInput);
      const id = opt(v, 'id');
      const fit = fitCurves(set, {
        ...(tg !== undefined ? { TgK: tg } : {}),
        ...(ref !== undefined ? { referenceK: ref } : {}),
        ...(perDecade !== undefined ? { termsPerDecade: perDecade } : {}),
        ...(id ? { id } : {}),
      });
      const law = fit.shiftLaw;
      const data = {
        kind: fit.kind,
        reference_C: kelvinToC(fit.referenceK),
        shifts: fit.shifts.map((s) => ({
          temperature_C: kelvinToC(s.temperatureK),
          log10_aT: s.log10aT,
          overlap_points: s.overlapPoints,
          rms_log10: s.rmsLog10,
          against_C: s.againstK === null ? null : kelvinToC(s.againstK),
        })),
        shift_law: {
          law: law.law,
          Tg_C: law.TgK === null ? null : kelvinToC(law.TgK),
          C1: law.C1,
          C2_K: law.C2K,
          Ea_kJmol: law.EakJmol,
          fitted: law.fitted,
          rms_log10: law.rmsLog10,
          quality: law.quality,
        },
        prony: {
          terms_per_decade: fit.termsPerDecade,
          rms_log10: fit.pronyRmsLog10,
          max_log10: fit.pronyMaxLog10,
          quality: fit.pronyQuality,
        },
        material: pronyToRecord(fit.material),
        quality: fit.quality,
        notes: fit.notes,
        caution: CAUTION,
      };
      const written = writeOut(v, data);
      const format = opt(v, 'format') ?? (v['json'] ? 'json' : 'md');
      if (!['md', 'csv', 'json'].includes(format)) throw new InputError('--format', `must be md, csv or json, got '${format}'`);
      if (format === 'json') {
        out.write(JSON.stringify(data, null, 2) + '\n');
        return;
      }
      const table = pronyToTable(fit.material).map((r) => r.map((c) => (typeof c === 'number' ? String(Number(c.toPrecision(6))) : c)));
      if (format === 'csv') {
        out.write(csvTable(['key', 'value'], table));
        return;
      }
      const shiftRows = fit.shifts.map((s) => [
        temperatureValue(kelvinToC(s.temperatureK)),
        s.log10aT.toFixed(3),
        String(s.overlapPoints),
        s.rmsLog10.toFixed(3),
      ]);
      out.write(
        `# Master curve at ${temperatureText(kelvinToC(fit.referenceK))} from ${set.curves.length} ${set.kind} curves (quality ${fit.quality})\n\n` +
          markdownTable(['temperature degC', 'log10 aT', 'overlap points', 'rms log10'], shiftRows) +
          `\nShift law ${law.law}: C1 ${NUM(law.C1)}, C2 ${NUM(law.C2K)} K (reference ${temperatureText(kelvinToC(fit.referenceK))})` +
          (law.EakJmol !== null ? `, Ea ${NUM(law.EakJmol)} kJ/mol below Tg` : '') +
          `; rms ${law.rmsLog10.toFixed(3)} decades (${law.quality})\n` +
          `Prony: ${fit.prony.terms.length} terms (${fit.termsPerDecade} per decade), rms ${fit.pronyRmsLog10.toFixed(4)} decades (${fit.pronyQuality})\n\n` +
          markdownTable(['key', 'value'], table) +
          fit.notes.map((n) => `\nnote: ${n}`).join('') +
          `\n\n${written}${CAUTION}\n`,
      );
    },
  },
  dmafit: {
    summary: 'fit the four-region parameters of a family to a DMA storage-modulus temperature sweep',
    usage: 'resin-derate dmafit --family ID --data SWEEP.csv --frequency 1 [--free F1,F2] [--id NAME] [--out FILE.json] [--json]',
    options: {
      ...material,
      data: { type: 'string' },
      frequency: { type: 'string' },
      free: { type: 'string' },
      id: { type: 'string' },
      out: { type: 'string' },
      ...json,
    },
    run(v, out) {
      checkOut(v);
      const start = materialInputFrom(v);
      const sweep = readDmaTable(parseCsv(readText(str(v, 'data'), '--data')));
      const f = need(v, 'frequency', frequencyInput);
      const free = freeFields(opt(v, 'free'));
      const id = opt(v, 'id');
      // Engine names (start, free, frequency) become options through the shared table of cli/failure.ts.
      const r = fitDma(start, sweep, { frequencyHz: f, ...(free ? { free } : {}), ...(id ? { id } : {}) });
      const data = {
        params: paramsToRecord(r.params),
        free: r.free,
        rms_log10: r.rmsLog10,
        max_log10: r.maxLog10,
        points: r.points,
        iterations: r.iterations,
        converged: r.converged,
        reason: r.reason,
        quality: r.quality,
        notes: r.notes,
        caution: CAUTION,
      };
      const written = writeOut(v, data);
      const rows = fittedRows(r.free);
      emit(
        out,
        v,
        data,
        `DMA fit of '${r.params.id}' to ${r.points} points at ${f} Hz: rms ${r.rmsLog10.toFixed(4)} decades (quality ${r.quality}; ${r.reason})\n\n` +
          markdownTable(['parameter', 'start', 'fitted', ''], rows) +
          r.notes.map((n) => `\nnote: ${n}`).join('') +
          `\n\n${written}${CAUTION}\n`,
      );
    },
  },
  creepmod: {
    summary: 'apparent creep modulus (stress / creep strain) under constant load at a temperature after a time',
    usage: "resin-derate creepmod --family ID --temp '80 degC' --time '1000 h' [--json]",
    options: { ...material, temp: { type: 'string' }, time: { type: 'string' }, ...json },
    run(v, out) {
      const m = resolveMaterial(materialInputFrom(v));
      const TK = checkTemperatureInDomain(m, need(v, 'temp', temperatureInput), '--temp');
      const tS = need(v, 'time', timeInput);
      const Ec = creepModulusMPa(m, tS, TK);
      const Er = modulusMPa(m, tS, TK);
      const data = {
        creep_modulus_MPa: Ec,
        relaxation_modulus_MPa: Er,
        ratio: Ec / Er,
        local_slope: localSlope(m, tS, TK),
        temperature_C: kelvinToC(TK),
        time_s: tS,
      };
      emit(
        out,
        v,
        data,
        `${m.params.id}: creep modulus ${modulusText(Ec)} (relaxation modulus ${modulusText(Er)} at the same time and temperature)\n`,
      );
    },
  },
  demodata: {
    summary: 'print the INVENTED demo test data (relaxation curves or a DMA sweep of the demo latch PC) as CSV',
    usage: 'resin-derate demodata --what relaxation|dma',
    options: { what: { type: 'string' } },
    run(v, out) {
      const what = opt(v, 'what') ?? 'relaxation';
      if (what !== 'relaxation' && what !== 'dma') throw new InputError('--what', `must be relaxation or dma, got '${what}'`);
      out.write(what === 'dma' ? inventedDmaCsv() : inventedRelaxationCsv());
    },
  },
};
