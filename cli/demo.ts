/**
 * The demo derating review printed to the terminal; the review itself is computed in review.ts, which
 * the workbook writer (workbook.ts) reads too.
 */
import { markdownTable, sig } from './format.js';
import type { Out } from './command.js';
import { computeDemo, DEMO_CAUTION, type DemoReview } from './review.js';
import { DEMO_SCENARIO as S } from './scenario.js';

/** Writes the scenario, the derating table, the duty-cycle check and the cautions. */
export function printDemo(review: DemoReview, out: Out): void {
  out.write(`# ${S.title}\n\n${S.story}\n\n`);
  out.write(`## Relaxation modulus after ${S.serviceTime} at constant temperature, MPa (ratio to 23 degC / 1 h)\n\n`);
  out.write(
    markdownTable(
      ['resin', ...S.temperaturesC.map((t) => `${t} degC`)],
      review.rows.map((r) => [r.id, ...r.cells.map((c) => `${sig(c.modulusMPa)} (${c.ratio === null ? '-' : c.ratio.toFixed(2)})`)]),
    ),
  );
  out.write(
    `\n## Daily cycle ${S.cycle.map(([T, h]) => `${h} h at ${T} degC`).join(' + ')}, ${S.cycles} days; required ${S.requiredModulusMPa} MPa\n\n`,
  );
  out.write(
    markdownTable(
      [
        'resin',
        `equivalent h at ${review.peakC} degC`,
        'modulus at end, MPa',
        'region',
        `stress held at ${S.heldStrain * 100} % strain, MPa`,
        `max degC for ${S.requiredModulusMPa} MPa over ${S.serviceTime}`,
        'verdict',
      ],
      review.checks.map((c) => [
        c.id,
        sig(c.equivalentH, 3),
        sig(c.afterMPa),
        c.region,
        sig(c.heldStressMPa),
        c.limitC === null ? (c.limitStatus === 'above-throughout' ? '> 500' : 'none') : sig(c.limitC, 3),
        c.pass ? 'pass' : 'FAIL',
      ]),
    ),
  );
  out.write(`\n${DEMO_CAUTION}\n`);
}

/** Prints the review (the CLI `demo` command also writes the workbook; see main.ts). */
export function runDemo(out: Out): DemoReview {
  const review = computeDemo();
  printDemo(review, out);
  return review;
}
