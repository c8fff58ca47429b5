/** The Prony material the engine tests share: four terms two decades apart and a hybrid shift law about Tg. */
import type { PronyMaterialSpec } from '../../src/index.js';

/** A made-up four-term Prony record of no real material (moduli MPa, times s, reference and Tg degC); `id` as each file names it. */
export function fourTermProny(id: string): PronyMaterialSpec {
  return {
    id,
    name: 'four terms',
    referenceC: 160,
    prony: { EinfMPa: 1.5, terms: [0.01, 1, 100, 1e4].map((tauS, i) => ({ tauS, EMPa: [1200, 600, 300, 20][i] ?? 0 })) },
    shiftLaw: 'hybrid',
    TgC: 147,
    C1: 12.3,
    C2K: 73,
    EakJmol: 600,
  };
}
