/**
 * Benchmarks of the worksheet layer (functions/): a 100 x 100 GRID and MAXTEMP through the wrappers,
 * argument parsing included, and the cold load of the built functions script in a fresh Node process
 * (a vm context with a stand-in CustomFunctions global, as Excel's runtime would give it).
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { SheetError } from '../functions/core/cells.js';
import { MAXTEMP } from '../functions/limits.js';
import { GRID } from '../functions/tables.js';
import { FAMILIES } from '../src/index.js';
import { median, medianMs, timeNs as medianNs } from './timing.js';

function check(out: unknown, what: string): void {
  if (out instanceof SheetError) throw new Error(`${what} gave ${out.code} ${out.message}`);
}

// A 100 x 100 GRID as a sheet passes it: a column of 100 family symbols (the bundled ones, repeated), a row
// of 100 temperatures, and the time as text. Once with bare numbers (degC), once with unit text in every cell.
const ids = Array.from({ length: 100 }, (_, i) => [FAMILIES[i % FAMILIES.length]?.params.id ?? 'PC']);
const tempsNumbers = [Array.from({ length: 100 }, (_, i) => -40 + i * 2.4)];
const tempsText = [Array.from({ length: 100 }, (_, i) => `${(-40 + i * 2.4).toFixed(1)} degC`)];

/** Milliseconds of a fresh `node` doing nothing, and of one loading dist/functions.js; the load itself timed inside. */
function coldLoad(file: string, runs: number): { loadMs: number; processMs: number; emptyProcessMs: number; associated: number } {
  const child = `
    const { readFileSync } = require('node:fs');
    const vm = require('node:vm');
    const ids = [];
    class OfficeError { constructor(code, message) { this.code = code; this.message = message; } }
    const CustomFunctions = {
      associate: (id) => ids.push(id),
      Error: OfficeError,
      ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A', invalidNumber: '#NUM!' },
    };
    const context = vm.createContext({ CustomFunctions, console, setTimeout, clearTimeout, queueMicrotask });
    // Timed: reading, compiling and running the script (its top level associates every function).
    const t0 = performance.now();
    vm.runInContext(readFileSync(${JSON.stringify(file)}, 'utf8'), context, { filename: 'functions.js' });
    const ms = performance.now() - t0;
    process.stdout.write(JSON.stringify({ ms, associated: ids.length }));
  `;
  const load: number[] = [];
  const proc: number[] = [];
  const empty: number[] = [];
  let associated = 0;
  for (let r = 0; r < runs; r++) {
    let t0 = process.hrtime.bigint();
    const e = spawnSync(process.execPath, ['-e', '0'], { encoding: 'utf8' });
    empty.push(Number(process.hrtime.bigint() - t0) / 1e6);
    if (e.status !== 0) throw new Error(`node -e 0 failed: ${e.stderr}`);
    t0 = process.hrtime.bigint();
    const c = spawnSync(process.execPath, ['-e', child], { encoding: 'utf8' });
    proc.push(Number(process.hrtime.bigint() - t0) / 1e6);
    if (c.status !== 0) throw new Error(`loading ${file} failed: ${c.stderr}`);
    const got = JSON.parse(c.stdout) as { ms: number; associated: number };
    load.push(got.ms);
    associated = got.associated;
  }
  return { loadMs: median(load), processMs: median(proc), emptyProcessMs: median(empty), associated };
}

function functionsScript(): string {
  // dist/bench.js sits beside dist/functions.js; fall back to the working directory.
  const beside = fileURLToPath(new URL('./functions.js', import.meta.url));
  return existsSync(beside) ? beside : 'dist/functions.js';
}

/** The wrapper-layer figures; the arguments are the engine figures of the same run, for the ratios. */
export function wrapperBench(modulusEvalNs: number, maxtempEngineUs: number, tableEngineMs: number) {
  check(GRID.invoke(ids, tempsNumbers, '1000 h'), 'GRID');
  check(GRID.invoke(ids, tempsText, '1000 h'), 'GRID (text)');
  const gridMs = medianMs(() => GRID.invoke(ids, tempsNumbers, '1000 h'), 21);
  const gridTextMs = medianMs(() => GRID.invoke(ids, tempsText, '1000 h'), 11);
  const material = [['PC']];
  check(MAXTEMP.invoke(material, 1200, 1000), 'MAXTEMP');
  const maxtempUs = medianNs((i) => MAXTEMP.invoke(material, 500 + (i % 1000), 1000), 2_000) / 1000;
  const cold = coldLoad(functionsScript(), 7);
  if (cold.associated < 21) throw new Error(`dist/functions.js associated only ${cold.associated} functions`);
  return {
    grid_100x100_wrapper_ms: gridMs,
    grid_wrapper_cell_ns: (gridMs * 1e6) / 10_000,
    grid_wrapper_cell_to_modulus_ratio: (gridMs * 1e6) / 10_000 / modulusEvalNs,
    grid_wrapper_to_engine_table_ratio: gridMs / tableEngineMs,
    grid_100x100_wrapper_text_temperatures_ms: gridTextMs,
    maxtemp_wrapper_us: maxtempUs,
    maxtemp_wrapper_to_engine_ratio: maxtempUs / maxtempEngineUs,
    functions_cold_load_ms: cold.loadMs,
    functions_cold_process_ms: cold.processMs,
    node_empty_process_ms: cold.emptyProcessMs,
    functions_associated: cold.associated,
  };
}
