/** Public engine API: pure TypeScript, no Office, DOM or Node-only imports. */
export * from './errors.js';
export * from './units.js';
export * from './shift.js';
export * from './params.js';
export * from './model.js';
export * from './families.js';
export * from './resolve.js';
export * from './roots.js';
export * from './solve.js';
export * from './band.js';
export * from './history.js';
export * from './hdt.js';
export * from './table.js';
export * from './stress.js';
