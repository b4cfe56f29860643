import { STANDARD_GRAVITY, compileSystemCurve, type CompiledSystemCurve } from '../../shared/hydraulics';

/**
 * A system H = staticHead + b Q^2 (SI), as textbook problems state it: all
 * resistance as one K on a pipe of 0.1 m bore and negligible length
 * (1e-9 m, whose own friction is below 1e-10 m at these flows).
 */
export function quadraticSystem(staticHead: number, b: number): CompiledSystemCurve {
  const area = (Math.PI * 0.1 * 0.1) / 4;
  return compileSystemCurve({
    staticHead,
    frictionMethod: 'hazen-williams',
    segments: [
      { length: 1e-9, insideDiameter: 0.1, hazenWilliamsC: 150, extraK: b * 2 * STANDARD_GRAVITY * area * area },
    ],
  });
}
