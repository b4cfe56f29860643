import { parallelHeadCurve, type HeadCurve } from '../../shared/hydraulics';
import type { CatalogState } from '../catalog/catalog-snapshot';

/**
 * What the hot loops read of every pump, in flat arrays built once per catalog state: head,
 * efficiency and power coefficients padded to a cubic (4 per pump), ranges, BEP flow and the
 * supplier's declared preferred range (NaN when absent).
 */
export interface PackedCurves {
  coefficients: Float64Array;
  flowMin: Float64Array;
  flowMax: Float64Array;
  efficiency: Float64Array;
  power: Float64Array;
  /** 0 none, 1 efficiency only, 2 fitted power (shaft), 3 fitted power (electrical). */
  powerSource: Uint8Array;
  electricalEfficiency: Uint8Array;
  bepFlow: Float64Array;
  declaredMin: Float64Array;
  declaredMax: Float64Array;
  /** 1 for a head curve estimated from two points (shut-off and open flow), else 0. */
  estimated: Uint8Array;
}

function padded(target: Float64Array, index: number, values: readonly number[] | null): void {
  values?.forEach((value, power) => {
    target[index * 4 + power] = value;
  });
}

/** The packed curves of a catalog state, built on first use and kept with the state. */
export function packedCurves(state: CatalogState): PackedCurves {
  const memo = state.derived.get('packed-curves') as PackedCurves | undefined;
  if (memo) return memo;
  const count = state.pumps.length;
  const packed: PackedCurves = {
    coefficients: new Float64Array(count * 4),
    flowMin: new Float64Array(count),
    flowMax: new Float64Array(count),
    efficiency: new Float64Array(count * 4),
    power: new Float64Array(count * 4),
    powerSource: new Uint8Array(count),
    electricalEfficiency: new Uint8Array(count),
    bepFlow: new Float64Array(count).fill(Number.NaN),
    declaredMin: new Float64Array(count).fill(Number.NaN),
    declaredMax: new Float64Array(count).fill(Number.NaN),
    estimated: new Uint8Array(count),
  };
  state.pumps.forEach(({ fit, declaredPreferred }, index) => {
    padded(packed.coefficients, index, fit.headCoefficients);
    padded(packed.efficiency, index, fit.efficiencyCoefficients);
    padded(packed.power, index, fit.powerCoefficients);
    packed.flowMin[index] = fit.flowMin;
    packed.flowMax[index] = fit.flowMax;
    packed.powerSource[index] = fit.powerCoefficients
      ? fit.powerBasis === 'electrical'
        ? 3
        : 2
      : fit.efficiencyCoefficients
        ? 1
        : 0;
    packed.electricalEfficiency[index] = fit.powerBasis === 'electrical' ? 1 : 0;
    packed.estimated[index] = fit.curveBasis === 'estimated-from-two-points' ? 1 : 0;
    if (fit.bep) packed.bepFlow[index] = fit.bep.flow;
    if (declaredPreferred) {
      packed.declaredMin[index] = declaredPreferred.flowMin;
      packed.declaredMax[index] = declaredPreferred.flowMax;
    }
  });
  state.derived.set('packed-curves', packed);
  return packed;
}

/** The cubic at `offset` of a packed coefficient array (4 per pump) at `flow`, by Horner. */
export function cubicAt(coefficients: Float64Array, offset: number, flow: number): number {
  return (
    coefficients[offset] +
    flow * (coefficients[offset + 1] + flow * (coefficients[offset + 2] + flow * coefficients[offset + 3]))
  );
}

/** Every pump's combined head curve for `running` identical pumps, built once per catalog state. */
export function combinedCurves(state: CatalogState, running: number): readonly HeadCurve[] {
  const key = `combined-curves-${running}`;
  let curves = state.derived.get(key) as HeadCurve[] | undefined;
  if (!curves) {
    curves = state.pumps.map((pump) => parallelHeadCurve(pump.fit, running));
    state.derived.set(key, curves);
  }
  return curves;
}
