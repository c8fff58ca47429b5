/** Prints the demo derating review of the invented scenario to the terminal. */
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
} from '../index.js';
import { markdownTable, sig } from './format.js';
import type { Out } from './main.js';
import { DEMO_SCENARIO as S } from './scenario.js';

/** Writes the scenario, the derating table, the duty-cycle check and the cautions. */
export function runDemo(out: Out): void {
  const tS = parseTimeS(S.serviceTime, 'serviceTime');
  out.write(`# ${S.title}\n\n${S.story}\n\n`);
  const rows = deratingTable(S.candidates, S.temperaturesC, tS);
  out.write(`## Relaxation modulus after ${S.serviceTime} at constant temperature, MPa (ratio to 23 degC / 1 h)\n\n`);
  out.write(
    markdownTable(
      ['resin', ...S.temperaturesC.map((t) => `${t} degC`)],
      rows.map((r) => [r.id, ...r.cells.map((c) => `${sig(c.modulusMPa)} (${c.ratio.toFixed(2)})`)]),
    ),
  );
  const segments = S.cycle.map(([T, h]) => ({ TK: cToKelvin(T), dtS: h * SECONDS_PER_HOUR }));
  const peak = Math.max(...S.cycle.map(([T]) => T));
  out.write(
    `\n## Daily cycle ${S.cycle.map(([T, h]) => `${h} h at ${T} degC`).join(' + ')}, ${S.cycles} days; required ${S.requiredModulusMPa} MPa\n\n`,
  );
  const checks = S.candidates.map((id) => {
    const m = resolveMaterial(id);
    const teq = equivalentTimeS(m, segments, cToKelvin(peak), S.cycles);
    const after = modulusAfterHistory(m, segments, S.cycles, cToKelvin(peak));
    const limit = maxTemperatureK(m, S.requiredModulusMPa, tS);
    const limitText = limit.value === null ? (limit.status === 'above-throughout' ? '> 500' : 'none') : sig(kelvinToC(limit.value), 3);
    return [
      id,
      sig(teq / SECONDS_PER_HOUR, 3),
      sig(after.modulusMPa),
      after.region,
      sig(after.modulusMPa * S.heldStrain),
      limitText,
      after.modulusMPa >= S.requiredModulusMPa ? 'pass' : 'FAIL',
    ];
  });
  out.write(
    markdownTable(
      [
        'resin',
        `equivalent h at ${peak} degC`,
        'modulus at end, MPa',
        'region',
        `stress held at ${S.heldStrain * 100} % strain, MPa`,
        `max degC for ${S.requiredModulusMPa} MPa over ${S.serviceTime}`,
        'verdict',
      ],
      checks,
    ),
  );
  out.write(
    '\nScreening estimates only. Real grades differ with filler, fibre orientation, moisture, ageing, chemicals, processing and stress level (the model is linear viscoelastic, small strain). Confirm with the supplier data and with creep or relaxation tests (ISO 899, ASTM D2990); apply the safety factors of the applicable code; for parts whose failure can hurt someone, defer to local codes and licensed engineering review.\n',
  );
}
