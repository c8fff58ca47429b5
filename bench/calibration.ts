/** Benchmarks of calibration and fitting: medians of repeated runs, in milliseconds. */
import { calibrateDatasheet, compileMaterial, fitCurves, getFamily, KELVIN_OFFSET, modulusMPa, type Curve } from '../src/index.js';
import { normal, seededRandom } from '../cli/demodata.js';
import { medianMs } from './timing.js';

const K = KELVIN_OFFSET;

/** One datasheet calibration: PBT from E23, HDT/A, HDT/B, Tg and Tm (two free parameters). */
function datasheet(): number {
  return calibrateDatasheet('PBT', {
    modulus23MPa: 2600,
    hdt: [
      { stressMPa: 1.8, temperatureK: 60 + K },
      { stressMPa: 0.45, temperatureK: 165 + K },
    ],
    TgK: 50 + K,
    TmK: 223 + K,
  }).iterations;
}

/** Five relaxation curves of 50 points (seeded 1 % noise), master curve, WLF and a 20-term Prony fit. */
// Transition time 100 s at Tg, so that the 1 s to 3 h curves at 150 to 170 degC cross the transition.
const truth = compileMaterial({ ...getFamily('PC').params, creepN: 0, tauTg_s: 100 });
const rand = seededRandom(99);
const curves: Curve[] = [150, 155, 160, 165, 170].map((c) => {
  const t = Array.from({ length: 50 }, (_, i) => 10 ** ((i * 4) / 49));
  return { temperatureK: c + K, timesS: t, moduliMPa: t.map((x) => modulusMPa(truth, x, c + K) * Math.exp(0.01 * normal(rand))), rows: [] };
});
let pronyTerms = 0;
function master(): number {
  // The master curve spans 9 decades: 19/9 terms per decade gives the 20-term series of the target.
  const f = fitCurves({ kind: 'relaxation', curves }, { TgK: 147 + K, termsPerDecade: 19 / 9 });
  pronyTerms = f.prony.terms.length;
  return f.prony.terms.length;
}

export function calibrationBench(): { datasheet_calibration_ms: number; master_curve_prony_ms: number; prony_terms: number } {
  const a = medianMs(datasheet, 15);
  const b = medianMs(master, 9);
  return { datasheet_calibration_ms: a, master_curve_prony_ms: b, prony_terms: pronyTerms };
}
