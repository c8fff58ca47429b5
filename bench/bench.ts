/** Benchmarks: medians over many runs, with ratios measured in the same run. `--json` prints one object. */
import {
  compileMaterial,
  deratingTable,
  equivalentTimeS,
  FAMILIES,
  getFamily,
  getGrade,
  maxTemperatureK,
  modulusMPa,
  shiftLog10,
} from '../src/index.js';
import { calibrationBench } from './calibration.js';
import { spreadsheetBench } from './spreadsheet.js';
import { pairedNs, timeNs } from './timing.js';
import { wrapperBench } from './wrappers.js';

const pc = compileMaterial(getFamily('PC').params);
const pa = compileMaterial(getFamily('PA66-cond').params);
// A glass-fibre grade: the semi-crystalline matrix plus the Halpin-Tsai ply averaged over the orientation.
const filled = compileMaterial(getGrade('PA66-dry-GF30').params);
const matrix = compileMaterial(getFamily('PA66-dry').params);
const temps = Array.from({ length: 1024 }, (_, i) => 253 + (i % 200));
const times = Array.from({ length: 1024 }, (_, i) => 10 ** ((i % 97) / 10));

// The floor: the bare WLF shift factor written inline (universal constants, PC's Tg), no function of ours.
const paired = pairedNs(
  (i) => {
    const dT = (temps[i & 1023] ?? 300) - 420.15;
    return 10 ** ((-17.44 * dT) / (51.6 + dT));
  },
  (i) => modulusMPa(pc, times[i & 1023] ?? 1, temps[i & 1023] ?? 300),
  100_000,
);
const wlfFloor = paired.a;
const modulusEval = paired.b;
// The engine's own shift function (hybrid WLF / Arrhenius with its singularity guard), as a figure of its own.
const engineShift = timeNs((i) => 10 ** shiftLog10(pc.shift, temps[i & 1023] ?? 300), 200_000);
const modulusSemi = timeNs((i) => modulusMPa(pa, times[i & 1023] ?? 1, temps[i & 1023] ?? 300), 200_000);
// Filled and unfilled measured as a pair in the same run, so their ratio is the filler's own cost.
const fill = pairedNs(
  (i) => modulusMPa(matrix, times[i & 1023] ?? 1, temps[i & 1023] ?? 300),
  (i) => modulusMPa(filled, times[i & 1023] ?? 1, temps[i & 1023] ?? 300),
  200_000,
);
const maxtempUs = timeNs((i) => maxTemperatureK(pc, 500 + (i % 1000), 3.6e6).value ?? 0, 2_000) / 1000;

// EQTIME over a 10,000-segment history (about a year of hourly readings, -20 to 99 degC) at its hottest segment (and
// 1 K above it): a colder reference would put the equivalent time beyond the model's 100 years, which is refused.
const segments = Array.from({ length: 10_000 }, (_, i) => ({ TK: 253.15 + ((i * 37) % 120), dtS: 3600 }));
const eqtimeUs = timeNs((i) => equivalentTimeS(pc, segments, 372.15 + (i % 2)), 20, 21) / 1000;
// A 100 x 100 derating table through the engine: 100 material rows (the bundled families, repeated) x 100 temperatures.
const tableIds = Array.from({ length: 100 }, (_, i) => FAMILIES[i % FAMILIES.length]?.params.id ?? 'PC');
const tableTemps = Array.from({ length: 100 }, (_, i) => -40 + i * 2.4);
const tableMs = timeNs((i) => deratingTable(tableIds, tableTemps, 3.6e6 + i).length, 3, 21) / 1e6;

const result = {
  machine: `${process.platform} ${process.arch}, node ${process.version}`,
  modulus_eval_ns: modulusEval,
  modulus_semicrystalline_ns: modulusSemi,
  modulus_unfilled_ns: fill.a,
  modulus_filled_ns: fill.b,
  modulus_filled_to_unfilled_ratio: fill.ratio,
  wlf_floor_ns: wlfFloor,
  engine_shift_ns: engineShift,
  modulus_to_floor_ratio: paired.ratio,
  maxtemp_us: maxtempUs,
  eqtime_10k_segments_us: eqtimeUs,
  eqtime_segment_ns: (eqtimeUs * 1000) / segments.length,
  eqtime_segment_to_floor_ratio: (eqtimeUs * 1000) / segments.length / wlfFloor,
  table_100x100_ms: tableMs,
  table_cell_ns: (tableMs * 1e6) / 10_000,
  table_cell_to_modulus_ratio: (tableMs * 1e6) / 10_000 / modulusEval,
  ...calibrationBench(),
  ...spreadsheetBench(),
  ...wrapperBench(modulusEval, maxtempUs, tableMs),
};

if (process.argv.includes('--json')) {
  console.log(JSON.stringify(result));
} else {
  console.log(`machine: ${result.machine}`);
  console.log(`floor: the bare WLF expression 10^(-C1 dT / (C2 + dT)) written inline: ${wlfFloor.toFixed(1)} ns`);
  console.log(
    `the engine's shift factor (hybrid law, guarded): ${engineShift.toFixed(1)} ns (${(engineShift / wlfFloor).toFixed(2)} x the floor)`,
  );
  console.log(`modulus evaluation, amorphous (PC): ${modulusEval.toFixed(1)} ns  (target < 1000 ns)`);
  console.log(`modulus evaluation, semi-crystalline (PA66-cond): ${modulusSemi.toFixed(1)} ns`);
  console.log(
    `modulus evaluation, filled (PA66-dry-GF30): ${fill.b.toFixed(1)} ns next to unfilled (PA66-dry) ${fill.a.toFixed(1)} ns in the same run (${fill.ratio.toFixed(2)} x; target < 2000 ns)`,
  );
  console.log(`ratio modulus / bare floor: ${result.modulus_to_floor_ratio.toFixed(2)}  (aim < 5)`);
  console.log(
    `HyperFormula recalculation, 10,000 cells: hand-typed WLF + stretched exponential ${result.hand_formula_10k_ms.toFixed(1)} ms, DERATE.MODULUS ${result.derate_modulus_10k_ms.toFixed(1)} ms (${result.derate_to_hand_formula_ratio.toFixed(2)} x)`,
  );
  console.log(`maxtemp solve: ${maxtempUs.toFixed(2)} us  (target < 20 us)`);
  console.log(`datasheet calibration (PBT: E23, HDT/A, HDT/B, Tg, Tm): ${result.datasheet_calibration_ms.toFixed(1)} ms  (target < 50 ms)`);
  console.log(
    `master curve 5 x 50 points + WLF + ${result.prony_terms}-term Prony: ${result.master_curve_prony_ms.toFixed(1)} ms  (target < 500 ms)`,
  );
  console.log(
    `eqtime over 10,000 segments: ${eqtimeUs.toFixed(0)} us  (${result.eqtime_segment_ns.toFixed(1)} ns a segment, ${result.eqtime_segment_to_floor_ratio.toFixed(2)} x the floor)`,
  );
  console.log(
    `derating table 100 x 100 through the engine: ${tableMs.toFixed(2)} ms  (${result.table_cell_ns.toFixed(0)} ns a cell, ${result.table_cell_to_modulus_ratio.toFixed(2)} x one modulus evaluation)`,
  );
  console.log(
    `GRID 100 x 100 through the wrapper, input parsing included: ${result.grid_100x100_wrapper_ms.toFixed(2)} ms  (target < 50 ms; ${result.grid_wrapper_cell_ns.toFixed(0)} ns a cell, ${result.grid_wrapper_cell_to_modulus_ratio.toFixed(2)} x one modulus evaluation, ${result.grid_wrapper_to_engine_table_ratio.toFixed(2)} x the engine table)`,
  );
  console.log(
    `GRID 100 x 100 with every temperature as unit text ("12.0 degC"): ${result.grid_100x100_wrapper_text_temperatures_ms.toFixed(2)} ms`,
  );
  console.log(
    `MAXTEMP through the wrapper: ${result.maxtemp_wrapper_us.toFixed(2)} us  (target < 20 us; ${result.maxtemp_wrapper_to_engine_ratio.toFixed(2)} x the engine solve)`,
  );
  console.log(
    `cold load of dist/functions.js in a fresh Node process (vm context, stand-in CustomFunctions, ${result.functions_associated} functions associated): ${result.functions_cold_load_ms.toFixed(1)} ms  (process ${result.functions_cold_process_ms.toFixed(0)} ms vs ${result.node_empty_process_ms.toFixed(0)} ms for an empty one)`,
  );
}
