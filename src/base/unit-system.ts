/**
 * The mathjs instance behind unit text: mathjs's own Unit class with its `unit` and `createUnit` functions,
 * created through mathjs's public factory API with scalar arithmetic of our own for numbers and fractions.
 * Why not mathjs's `unitDependencies`: its all-type arithmetic brings decimal.js, complex.js, the matrix
 * classes and their algorithms into every bundle (119 of the start-up script's 316 kB minified, 36 kB gzip), for
 * values this project never makes. With `number: 'number'` a Unit holds numbers; fractions appear only as
 * the exact 5/9 of the degF and degR definitions, which Unit mixes with numbers through typed-function's
 * number-to-Fraction conversion, exactly as mathjs's own arithmetic does.
 */
import {
  create,
  createCreateUnit,
  createFormat,
  createFractionClass,
  createIsNumeric,
  createNumber,
  createTyped,
  createUnitClass,
  createUnitFunction,
  factory,
} from 'mathjs';

/** The part of a fraction.js value the arithmetic below uses. */
interface Fraction {
  add(y: Fraction): Fraction;
  sub(y: Fraction): Fraction;
  mul(y: Fraction): Fraction;
  div(y: Fraction): Fraction;
  pow(y: Fraction): Fraction | null;
  abs(): Fraction;
  trunc(): Fraction;
  round(): Fraction;
  equals(y: Fraction): boolean;
  valueOf(): number;
}

/** x^y for numbers as mathjs computes it for a real result (x^±Infinity is 0 where it tends to 0). */
function powNumber(x: number, y: number): number {
  if ((x * x < 1 && y === Infinity) || (x * x > 1 && y === -Infinity)) return 0;
  if (x < 0 && !Number.isInteger(y)) {
    // mathjs would answer with a Complex number; unit factors and powers never lead here.
    throw new TypeError(`pow: ${x}^${y} is not a real number, and unit text is read with real numbers only`);
  }
  return Math.pow(x, y);
}

/** A two-argument function of numbers and of fractions; typed-function converts a number met with a fraction. */
function binary(name: string, numbers: (x: number, y: number) => number, fractions: (x: Fraction, y: Fraction) => Fraction | number) {
  return factory(name, ['typed'], ({ typed }) => typed(name, { 'number, number': numbers, 'Fraction, Fraction': fractions }));
}

/** A one-argument function of a number or a fraction. */
function unary(name: string, numbers: (x: number) => number, fractions: (x: Fraction) => Fraction) {
  return factory(name, ['typed'], ({ typed }) => typed(name, { number: numbers, Fraction: fractions }));
}

/**
 * Equality within mathjs's default tolerances (config relTol 1e-12, absTol 1e-15). Unit uses `equal`, `round`
 * and `fix` only in `equals` and `splitUnit`, which this project never calls; they are kept simple (no
 * snapping of near-integers in `fix`) rather than copied from mathjs.
 */
function nearlyEqual(a: number, b: number): boolean {
  if (Number.isNaN(a) || Number.isNaN(b)) return false;
  if (!Number.isFinite(a) || !Number.isFinite(b) || a === b) return a === b;
  return Math.abs(a - b) <= Math.max(1e-12 * Math.max(Math.abs(a), Math.abs(b)), 1e-15);
}

/** A class this build refuses: config `number: 'number'` means Unit never makes one. */
function refused(name: string): Error {
  return new TypeError(
    `${name} values are not available: unit text is read with plain numbers (a mathjs unit system built without ${name})`,
  );
}

const createBigNumberRefused = factory(
  'BigNumber',
  [],
  () =>
    function BigNumber(): never {
      throw refused('BigNumber');
    },
  { isClass: true },
);

const createComplexRefused = factory(
  'Complex',
  [],
  () => {
    // Unit reads Complex.I once, as the value of its VAR (volt-ampere reactive) definition; any use of
    // that value fails in the arithmetic above, so text in VAR is refused as an unknown unit.
    const Complex = function Complex(): never {
      throw refused('Complex');
    };
    return Object.assign(Complex, { I: Object.freeze({ refused: 'Complex' }) });
  },
  { isClass: true },
);

const factories = {
  createTyped,
  createFractionClass,
  createBigNumberRefused,
  createComplexRefused,
  createNumber,
  createIsNumeric,
  createFormat,
  addScalar: binary(
    'addScalar',
    (x, y) => x + y,
    (x, y) => x.add(y),
  ),
  subtractScalar: binary(
    'subtractScalar',
    (x, y) => x - y,
    (x, y) => x.sub(y),
  ),
  multiplyScalar: binary(
    'multiplyScalar',
    (x, y) => x * y,
    (x, y) => x.mul(y),
  ),
  divideScalar: binary(
    'divideScalar',
    (x, y) => x / y,
    (x, y) => x.div(y),
  ),
  // A fraction power with no rational result falls back to numbers, as mathjs does.
  pow: binary('pow', powNumber, (x, y) => x.pow(y) ?? powNumber(x.valueOf(), y.valueOf())),
  abs: unary('abs', Math.abs, (x) => x.abs()),
  fix: unary('fix', Math.trunc, (x) => x.trunc()),
  // Half away from zero, as mathjs rounds.
  round: unary(
    'round',
    (x) => Math.sign(x) * Math.round(Math.abs(x)),
    (x) => x.round(),
  ),
  equal: factory('equal', ['typed'], ({ typed }) =>
    typed('equal', { 'number, number': nearlyEqual, 'Fraction, Fraction': (x: Fraction, y: Fraction) => x.equals(y) }),
  ),
  createUnitClass,
  createUnitFunction,
  createCreateUnit,
};

/** The unit system: `math.unit(text)`, `math.unit(value, unit)` and `math.createUnit(name, definition)`. */
export const math = create(factories, { number: 'number' });
