/**
 * The demo derating review printed to the terminal; the review itself is computed in review.ts, which
 * the workbook writer (workbook.ts) reads too.
 */
import { durationText, modulusText, mpaValue, ratioText, SECONDS_PER_HOUR, temperatureValue, VERDICT } from '../src/index.js';
import { markdownTable } from './format.js';
import type { Out } from './command.js';
import { computeDemo, DEMO_CAUTION, DEMO_FILLED_CAUTION, type DemoReview } from './review.js';
import { DEMO_SCENARIO as S } from './scenario.js';

/** Writes the scenario, the derating table, the duty-cycle check and the cautions. */
export function printDemo(review: DemoReview, out: Out): void {
  out.write(`# ${S.title}\n\n${S.story}\n\n`);
  out.write(`## Relaxation modulus after ${S.serviceTime} at constant temperature, MPa (ratio to 23 degC / 1 h)\n\n`);
  out.write(
    markdownTable(
      ['resin', ...S.temperaturesC.map((t) => `${t} degC`)],
      review.rows.map((r) => [r.id, ...r.cells.map((c) => `${mpaValue(c.modulusMPa)} (${c.ratio === null ? '-' : ratioText(c.ratio)})`)]),
    ),
  );
  out.write(
    `\n## Daily cycle ${S.cycle.map(([T, h]) => `${h} h at ${T} degC`).join(' + ')}, ${S.cycles} days; required ${modulusText(S.requiredModulusMPa)}\n\n`,
  );
  out.write(
    markdownTable(
      [
        'resin',
        `equivalent time at ${temperatureValue(review.peakC)} degC`,
        'modulus at end, MPa',
        'region',
        `stress held at ${S.heldStrain * 100} % strain, MPa`,
        `max degC for ${modulusText(S.requiredModulusMPa)} over ${S.serviceTime}`,
        'verdict',
      ],
      review.checks.map((c) => [
        c.id,
        durationText(c.equivalentH * SECONDS_PER_HOUR),
        mpaValue(c.afterMPa),
        c.region,
        mpaValue(c.heldStressMPa),
        c.limitC === null ? (c.limitStatus === 'above-throughout' ? 'above 500' : 'none') : temperatureValue(c.limitC),
        c.pass ? VERDICT.pass : VERDICT.fail,
      ]),
    ),
  );
  out.write(`\n${DEMO_CAUTION}\n\n${DEMO_FILLED_CAUTION}\n`);
}

/** Prints the review (the CLI `demo` command also writes the workbook; see main.ts). */
export function runDemo(out: Out): DemoReview {
  const review = computeDemo();
  printDemo(review, out);
  return review;
}
