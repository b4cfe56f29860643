/*
 * Riffle's hydraulics engine: pure functions on SI numbers, for Node and the
 * browser alike. Units are converted only at the edges (units.ts).
 */
export * from './hydraulics-error';
export * from './engine-issues';
export * from './physical-constants';
export * from './units';
export * from './water-properties';
export * from './pipe-catalogue';
export * from './pipe-size-for-velocity';
export * from './metric-pipe-series';
export * from './fittings-catalogue';
export * from './friction';
export * from './cubic-hermite-table';
export * from './bracketed-newton';
export * from './system-input';
export * from './system-curve';
export * from './system-breakdown';
export * from './branched-system';
export * from './branch-flows';
export * from './polynomial';
export * from './pump-curve-fit';
export * from './pump-curve-evaluation';
export * from './operating-point';
export * from './pump-arrangements';
export * from './operating-regions';
export * from './power-and-energy';
export * from './wire-to-water';
export * from './life-cycle-cost';
export * from './affinity-laws';
export * from './npsh';
export * from './plausible-limits';
export * from './pump-curve-points';
export * from './suction-side';
export * from './gravity-flow';
export * from './pump-speeds';
