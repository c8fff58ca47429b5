/**
 * The words of a requirement check, shared by every front-end (workbook, pane, CLI) so that a review
 * reads the same wherever it was made.
 */
export const VERDICT = { pass: 'pass', fail: 'fail' } as const;

export type Verdict = (typeof VERDICT)[keyof typeof VERDICT];

/** The verdict of a modulus (MPa) against a required modulus (MPa): it passes when it is at least the requirement. */
export function verdictOf(modulusMPa: number, requiredMPa: number): Verdict {
  return modulusMPa >= requiredMPa ? VERDICT.pass : VERDICT.fail;
}
