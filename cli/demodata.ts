/**
 * INVENTED demo test data for the PC latch of the demo scenario (scenario.ts): relaxation curves at
 * five temperatures and a DMA sweep, generated from a made-up grade with seeded noise. They are not
 * measurements of any real material; they exist so that `resin-derate fit` and `dmafit` can be tried.
 * The files demo/latch-pc-*-invented.csv are this module's output (a test checks that they match).
 */
import { compileMaterial, getFamily, modulusMPa, storageModulusMPa, type MaterialParams } from '../src/index.js';
import { KELVIN_OFFSET } from '../src/index.js';

/** The invented grade: the PC family with a slightly different Tg, breadth, WLF constants and transition time. */
export const INVENTED_LATCH_PC: MaterialParams = {
  ...getFamily('PC').params,
  id: 'latch-PC-invented',
  name: 'PC grade of the demo latch (invented)',
  Tg_C: 149,
  Tg_low_C: null,
  Tg_high_C: null,
  beta: 0.35,
  C1: 16,
  C2_K: 55,
  creepN: 0,
  // A slower transition than the family's 1 s, so that the 10 s to 1 h invented curves cross it.
  tauTg_s: 100,
};

/** Invented datasheet numbers of the same grade (for `calibrate`). */
export const INVENTED_LATCH_DATASHEET = { modulus23MPa: 2350, hdtA_C: 133, hdtB_C: 143, Tg_C: 149 } as const;

export const DEMO_CURVE_TEMPERATURES_C = [144, 149, 152, 155, 158] as const;
/** Smallest modulus an invented relaxation test records, MPa (below it a real load cell reads noise). */
export const DEMO_MIN_MODULUS_MPA = 0.05;
export const DEMO_NOISE = 0.015;
export const DEMO_SEED = 20261202;

/** mulberry32: a small seeded generator (public-domain algorithm by Tommy Ettinger). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviate by Box-Muller. */
export function normal(rand: () => number): number {
  const u = Math.max(rand(), 1e-300);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}

const HEADER = (what: string): string =>
  `# INVENTED demo data (${what}) for the latch PC grade of the Resin Derate demo scenario; not measured, generated from a made-up parameter set with ${DEMO_NOISE * 100} % seeded noise.\n`;

/** Relaxation curves, 12 points per curve from 10 s to 10 h, as CSV text. */
export function inventedRelaxationCsv(): string {
  const m = compileMaterial(INVENTED_LATCH_PC);
  const rand = seededRandom(DEMO_SEED);
  const lines = [HEADER('stress relaxation at five temperatures'), 'temperature_C,time_s,modulus_MPa\n'];
  for (const T of DEMO_CURVE_TEMPERATURES_C) {
    for (let i = 0; i < 12; i++) {
      const t = 10 ** (1 + (i * Math.log10(3600)) / 11);
      const E = modulusMPa(m, t, T + KELVIN_OFFSET) * Math.exp(DEMO_NOISE * normal(rand));
      if (E < DEMO_MIN_MODULUS_MPA) break;
      lines.push(`${T},${Number(t.toPrecision(4))},${Number(E.toPrecision(4))}\n`);
    }
  }
  return lines.join('');
}

/** DMA storage modulus at 1 Hz from 30 to 190 degC every 5 K, as CSV text. */
export function inventedDmaCsv(): string {
  const m = compileMaterial(INVENTED_LATCH_PC);
  const rand = seededRandom(DEMO_SEED + 1);
  const lines = [HEADER('DMA storage modulus at 1 Hz'), 'temperature_C,storage_MPa\n'];
  for (let T = 30; T <= 190; T += 5) {
    const E = storageModulusMPa(m, 1, T + KELVIN_OFFSET) * Math.exp(DEMO_NOISE * normal(rand));
    lines.push(`${T},${Number(E.toPrecision(4))}\n`);
  }
  return lines.join('');
}
