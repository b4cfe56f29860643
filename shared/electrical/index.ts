/*
 * Riffle's electrical side of a pump: copper conductor tables and the voltage drop of the cable
 * run to the pump. Pure functions on SI numbers (A, V, m, ohm), for Node and the browser alike;
 * refusals are the engine's HydraulicsInputError with codes (shared/hydraulics/engine-issues.ts).
 */
export * from './conductor-tables';
export * from './voltage-drop';
