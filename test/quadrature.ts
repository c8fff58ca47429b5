/** Quadrature for the convolution-identity checks. */

/** Trapezoid rule on a grid graded geometrically toward the end where the integrand varies fast. */
export function graded(f: (x: number) => number, a: number, b: number, fast: 'start' | 'end', n = 6000): number {
  const node = (k: number): number => {
    const g = k === 0 ? 0 : 10 ** (-14 + (14 * k) / n);
    return fast === 'start' ? a + (b - a) * g : b - (b - a) * g;
  };
  let sum = 0;
  for (let k = 0; k < n; k++) {
    const x0 = node(k);
    const x1 = node(k + 1);
    sum += (Math.abs(x1 - x0) * (f(x0) + f(x1))) / 2;
  }
  return sum;
}
