/** Timing helpers shared by the benchmarks: medians of repeated runs, measured with process.hrtime. */

/** Keeps results alive so the optimizer cannot drop the timed calls. */
let sink: unknown;

/** Median of a list (the upper middle for an even count). */
export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? NaN;
}

/** Median milliseconds of fn over `rounds` runs after one warm-up. */
export function medianMs(fn: () => unknown, rounds: number): number {
  sink = fn();
  const times: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const t0 = process.hrtime.bigint();
    sink = fn();
    times.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  return median(times);
}

/** Median nanoseconds per call of fn over `rounds` rounds of `inner` calls, after one warm-up round. */
export function timeNs(fn: (i: number) => unknown, inner: number, rounds = 31): number {
  for (let i = 0; i < inner; i++) sink = fn(i);
  const per: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const t0 = process.hrtime.bigint();
    for (let i = 0; i < inner; i++) sink = fn(i);
    per.push(Number(process.hrtime.bigint() - t0) / inner);
  }
  return median(per);
}

/**
 * Two functions timed in alternating rounds, so that load from other jobs falls on both alike; the ratio is
 * the median of the per-round ratios b / a.
 */
export function pairedNs(
  fa: (i: number) => unknown,
  fb: (i: number) => unknown,
  inner: number,
  rounds = 41,
): { a: number; b: number; ratio: number } {
  const as: number[] = [];
  const bs: number[] = [];
  const ratios: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const a = timeNs(fa, inner, 1);
    const b = timeNs(fb, inner, 1);
    as.push(a);
    bs.push(b);
    ratios.push(b / a);
  }
  return { a: median(as), b: median(bs), ratio: median(ratios) };
}

/** The last result kept by the timers (read it once so the sink is used). */
export function lastResult(): unknown {
  return sink;
}
