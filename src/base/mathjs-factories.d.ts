// mathjs exports the factory of every function and class from its main entry (mathjs's documentation,
// "Custom bundling"), but its type declarations name only the dependency maps; these are the ones
// src/base/unit-system.ts creates its unit system from.
import type { FactoryFunction } from 'mathjs';

declare module 'mathjs' {
  export const createTyped: FactoryFunction<unknown>;
  export const createFractionClass: FactoryFunction<unknown>;
  export const createNumber: FactoryFunction<unknown>;
  export const createIsNumeric: FactoryFunction<unknown>;
  export const createFormat: FactoryFunction<unknown>;
  export const createUnitClass: FactoryFunction<unknown>;
  export const createUnitFunction: FactoryFunction<unknown>;
  export const createCreateUnit: FactoryFunction<unknown>;
}
