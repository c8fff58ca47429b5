/**
 * Reductions over arrays of any length by loops. Math.min(...xs), Math.max(...xs) and
 * Math.hypot(...xs) pass every element as a call argument and overflow the call stack somewhere
 * above 100,000 elements (V8), which a user's data (hourly logger records, long test files) reaches.
 */

/** Smallest element (Infinity for an empty array; NaN if any element is NaN, as Math.min). */
export function minOf(xs: readonly number[]): number {
  let m = Infinity;
  for (const x of xs) {
    if (Number.isNaN(x)) return NaN;
    if (x < m) m = x;
  }
  return m;
}

/** Largest element (-Infinity for an empty array; NaN if any element is NaN, as Math.max). */
export function maxOf(xs: readonly number[]): number {
  let m = -Infinity;
  for (const x of xs) {
    if (Number.isNaN(x)) return NaN;
    if (x > m) m = x;
  }
  return m;
}

/** Euclidean norm sqrt(sum x^2), scaled by the largest |x| so that it neither overflows nor underflows (as Math.hypot). */
export function norm2(xs: readonly number[]): number {
  let scale = 0;
  for (const x of xs) {
    const a = Math.abs(x);
    if (Number.isNaN(a)) return NaN;
    if (a > scale) scale = a;
  }
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  let sum = 0;
  for (const x of xs) sum += (x / scale) ** 2;
  return scale * Math.sqrt(sum);
}
