/** Benchmarks: medians over many runs, with ratios measured in the same run. `--json` prints one object. */
import { compileMaterial, getFamily, maxTemperatureK, modulusMPa, shiftLog10 } from '../src/index.js';
import { calibrationBench } from './calibration.js';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? NaN;
}

/** Median nanoseconds per call of fn over `rounds` rounds of `inner` calls. */
function timeNs(fn: (i: number) => number, inner: number, rounds = 31): number {
  let sink = 0;
  for (let i = 0; i < inner; i++) sink += fn(i);
  const per: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const t0 = process.hrtime.bigint();
    for (let i = 0; i < inner; i++) sink += fn(i);
    per.push(Number(process.hrtime.bigint() - t0) / inner);
  }
  if (sink === 42.4242) console.log('');
  return median(per);
}

const pc = compileMaterial(getFamily('PC').params);
const pa = compileMaterial(getFamily('PA66-cond').params);
const temps = Array.from({ length: 1024 }, (_, i) => 253 + (i % 200));
const times = Array.from({ length: 1024 }, (_, i) => 10 ** ((i % 97) / 10));

const wlfFloor = timeNs((i) => 10 ** shiftLog10(pc.shift, temps[i & 1023] ?? 300), 200_000);
const modulusEval = timeNs((i) => modulusMPa(pc, times[i & 1023] ?? 1, temps[i & 1023] ?? 300), 200_000);
const modulusSemi = timeNs((i) => modulusMPa(pa, times[i & 1023] ?? 1, temps[i & 1023] ?? 300), 200_000);
const maxtempUs = timeNs((i) => maxTemperatureK(pc, 500 + (i % 1000), 3.6e6).value ?? 0, 2_000) / 1000;

const result = {
  machine: `${process.platform} ${process.arch}, node ${process.version}`,
  modulus_eval_ns: modulusEval,
  modulus_semicrystalline_ns: modulusSemi,
  wlf_floor_ns: wlfFloor,
  modulus_to_floor_ratio: modulusEval / wlfFloor,
  maxtemp_us: maxtempUs,
  ...calibrationBench(),
};

if (process.argv.includes('--json')) {
  console.log(JSON.stringify(result));
} else {
  console.log(`machine: ${result.machine}`);
  console.log(`bare WLF shift factor a_T (floor): ${wlfFloor.toFixed(1)} ns`);
  console.log(`modulus evaluation, amorphous (PC): ${modulusEval.toFixed(1)} ns  (target < 1000 ns)`);
  console.log(`modulus evaluation, semi-crystalline (PA66-cond): ${modulusSemi.toFixed(1)} ns`);
  console.log(`ratio modulus / floor: ${result.modulus_to_floor_ratio.toFixed(2)}  (target < 5)`);
  console.log(`maxtemp solve: ${maxtempUs.toFixed(2)} us  (target < 20 us)`);
  console.log(`datasheet calibration (PBT: E23, HDT/A, HDT/B, Tg, Tm): ${result.datasheet_calibration_ms.toFixed(1)} ms  (target < 50 ms)`);
  console.log(
    `master curve 5 x 50 points + WLF + ${result.prony_terms}-term Prony: ${result.master_curve_prony_ms.toFixed(1)} ms  (target < 500 ms)`,
  );
}
