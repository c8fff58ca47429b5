/**
 * The demo review of the invented scenario as data: computed once by the engine, then read by the
 * terminal printer (demo.ts) and by the workbook writer (workbook.ts), which depend on this file and
 * never on each other.
 */
import {
  cToKelvin,
  deratingTable,
  equivalentTimeS,
  kelvinToC,
  maxTemperatureK,
  modulusAfterHistory,
  parseTimeS,
  resolveMaterial,
  SECONDS_PER_HOUR,
  type InverseStatus,
  type Region,
  type TableRow,
} from '../src/index.js';
import { DEMO_SCENARIO as S } from './scenario.js';

export const DEMO_CAUTION =
  'Screening estimates only. Real grades differ with filler, fibre orientation, moisture, ageing, chemicals, processing and stress level (the model is linear viscoelastic, small strain). Confirm with the supplier data and with creep or relaxation tests (ISO 899, ASTM D2990); apply the safety factors of the applicable code; for parts whose failure can hurt someone, defer to local codes and licensed engineering review.';

/** The caution a filled candidate adds: its estimate is along flow, as the datasheet value is. */
export const DEMO_FILLED_CAUTION =
  'Filled grades (PBT-GF30 here) are estimated along the flow direction, where the fibres lie, as datasheets give them: across flow and at weld lines the modulus is lower, so check that the latch arm is filled along its length and carries no weld line.';

/** One candidate's duty-cycle check. */
export interface DutyCheck {
  readonly id: string;
  /** Equivalent time at the peak cycle temperature, hours. */
  readonly equivalentH: number;
  /** Modulus after the repeated cycle, read at the peak temperature, MPa. */
  readonly afterMPa: number;
  readonly region: Region;
  /** Stress held at the scenario's strain after the cycle, MPa. */
  readonly heldStressMPa: number;
  /** Highest constant temperature keeping the required modulus over the service time, degC (null: see status). */
  readonly limitC: number | null;
  readonly limitStatus: InverseStatus;
  readonly pass: boolean;
}

/** Everything the review shows, in engine units converted for display. */
export interface DemoReview {
  readonly serviceS: number;
  readonly peakC: number;
  readonly rows: readonly TableRow[];
  readonly checks: readonly DutyCheck[];
}

/** Computes the review of the invented scenario with the engine. */
export function computeDemo(): DemoReview {
  const serviceS = parseTimeS(S.serviceTime, 'serviceTime');
  const rows = deratingTable(S.candidates, S.temperaturesC, serviceS);
  const segments = S.cycle.map(([T, h]) => ({ TK: cToKelvin(T), dtS: h * SECONDS_PER_HOUR }));
  const peakC = Math.max(...S.cycle.map(([T]) => T));
  const checks = S.candidates.map((id): DutyCheck => {
    const m = resolveMaterial(id);
    const after = modulusAfterHistory(m, segments, S.cycles, cToKelvin(peakC));
    const limit = maxTemperatureK(m, S.requiredModulusMPa, serviceS);
    return {
      id,
      equivalentH: equivalentTimeS(m, segments, cToKelvin(peakC), S.cycles) / SECONDS_PER_HOUR,
      afterMPa: after.modulusMPa,
      region: after.region,
      heldStressMPa: after.modulusMPa * S.heldStrain,
      limitC: limit.value === null ? null : kelvinToC(limit.value),
      limitStatus: limit.status,
      pass: after.modulusMPa >= S.requiredModulusMPa,
    };
  });
  return { serviceS, peakC, rows, checks };
}
