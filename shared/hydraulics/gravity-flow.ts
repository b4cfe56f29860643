import { bracketedNewton, type FunctionWithSlope } from './bracketed-newton';
import type { CompiledSystemCurve } from './system-curve';

/*
 * Gravity flow and siphons: with the outlet below the intake the system's head is negative at
 * zero flow, and water runs with no pump until the losses use up the fall.
 */

/** Above this flow, m3/s, no pipe within the system limits passes water: the search stops. */
const MAX_GRAVITY_FLOW = 1e3;

/**
 * The flow gravity alone delivers through `system`, m3/s: the root of H_system(Q) = 0, i.e.
 * where static head plus outlet pressure head plus losses sum to zero (the energy equation
 * between the two surfaces with no pump; Karassik, Pump Handbook, 4th ed., ch. 10, system
 * curve). Null when the system's head at zero flow is not negative (water needs a pump). The
 * root is found by the bracketed Newton solver (bracketed-newton.ts), as the system head rises
 * with flow.
 * @param system - the compiled system curve
 * @returns the gravity flow, m3/s, or null
 * @example
 * // 2 m fall through a system of H = -2 + 50000 Q^2 (no friction, K only): Q = sqrt(2/50000) = 6.3246 L/s by hand
 * gravityFlow({ staticHead: -2, headAndSlope: (q, out) => { out[0] = -2 + 5e4 * q * q; out[1] = 1e5 * q; }, evaluate: (q) => -2 + 5e4 * q * q }) // => 6.3246e-3
 */
export function gravityFlow(
  system: Pick<CompiledSystemCurve, 'staticHead' | 'headAndSlope' | 'evaluate'>,
): number | null {
  if (!(system.staticHead < 0)) return null;
  let high = 1e-3;
  while (system.evaluate(high) < 0) {
    if (high >= MAX_GRAVITY_FLOW) return null;
    high *= 2;
  }
  const falling: FunctionWithSlope = {
    valueAndSlope(flow, out) {
      system.headAndSlope(flow, out);
      out[0] = -out[0];
      out[1] = -out[1];
    },
  };
  const stopping = { finalStep: 1e-10 * high, bracketWidth: 1e-13 * high, maxIterations: 100 };
  return bracketedNewton(falling, 0, high, high / 2, stopping).root;
}
