/**
 * A record of the model at the hot end and over the long term, per family (issue 12): simulated HDT/A and
 * HDT/B, the short-term modulus at elevated temperatures, E(1000 h)/E(10 s) and the 1000 h creep modulus
 * at 23 degC, the apparent Tg over 10 s and 1000 h. Run: node scripts/run-ts.mjs bench/physics.ts (or bundle with esbuild).
 */
import { FAMILIES, compileMaterial, modulusMPa, simulateHdt, apparentTgK, creepModulusMPa, evaluateClocks } from '../src/index.js';

const K = 273.15;
const H = 3600;
const f1 = (x: number | null): string => (x === null ? '-' : x.toFixed(0));
const rows: string[] = [];
rows.push(
  [
    'id',
    'Tg',
    'HDT/A',
    'HDT/B',
    'E23',
    'E60',
    'E80',
    'E120',
    'E150',
    'r1000h/10s',
    'Ec1000h',
    'Tg@10s',
    'Tg@1000h',
    'reg80',
    'reg120',
  ].join('\t'),
);
for (const f of FAMILIES) {
  const m = compileMaterial(f.params);
  const a = simulateHdt(m, 1.8).temperatureC;
  const b = simulateHdt(m, 0.45).temperatureC;
  const E = (T: number, t = 10): number => modulusMPa(m, t, T + K);
  const tg10 = apparentTgK(m, 10);
  const tg1000 = apparentTgK(m, 1000 * H);
  let ec: number | null = null;
  try {
    ec = creepModulusMPa(m, 1000 * H, 23 + K);
  } catch {
    ec = null;
  }
  rows.push(
    [
      f.params.id,
      f.params.Tg_C,
      f1(a),
      f1(b),
      f1(E(23)),
      f1(E(60)),
      f1(E(80)),
      f1(E(120)),
      f1(E(150)),
      (E(23, 1000 * H) / E(23)).toFixed(3),
      f1(ec),
      tg10 === null ? '-' : (tg10 - K).toFixed(0),
      tg1000 === null ? '-' : (tg1000 - K).toFixed(0),
      evaluateClocks(m, 10, 80 + K).region,
      evaluateClocks(m, 10, 120 + K).region,
    ].join('\t'),
  );
}
console.log(rows.join('\n'));
