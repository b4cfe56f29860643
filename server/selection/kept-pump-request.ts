import type { KeptSetPoint, SelectionRequest } from '../../shared/api/api-schemas';
import { motorEfficiencyFor } from '../../shared/hydraulics';
import type { MixedSetPoint } from '../calculations/mixed-set-duty';
import { unprocessable } from '../calculations/engine-problem';
import { fitInlinePump } from '../calculations/pump-request';
import { answerUnits } from '../calculations/request-units';
import type { CatalogState } from '../catalog/catalog-snapshot';
import type { KeptPump, KeptSetDuty } from './selection-query';

/* The request's `keep` (SelectionKeep) checked and resolved, and a kept set as the answer gives it. */

/**
 * The kept pump of `body`, or null without `keep`: a catalog pump of the current state or an
 * inline curve (fitted, refusals pointing under `/body/keep/pump`). One added pump beside it,
 * with no standby: other arrangements and a standby are 422s naming the field.
 */
export function keptPumpOf(
  body: SelectionRequest,
  state: CatalogState,
  motorEfficiency: number | null,
): KeptPump | null {
  const keep = body.keep;
  if (!keep) return null;
  if (body.arrangements && (body.arrangements.length !== 1 || body.arrangements[0] !== 1))
    throw unprocessable(
      '/body/arrangements',
      'with keep, one pump is added beside the kept one: leave it out or give [1]',
    );
  if (body.standby)
    throw unprocessable('/body/standby', 'with keep, the set is the kept pump and one added pump, with no standby');
  const spec = keep.pump;
  let kept: KeptPump;
  if ('pumpId' in spec) {
    const pump = state.byId.get(spec.pumpId);
    if (!pump) throw unprocessable('/body/keep/pump/pumpId', 'no active catalog pump with a current curve has this id');
    kept = { pump, pumpId: pump.pumpId, motorEfficiency: motorEfficiencyFor(pump, motorEfficiency).value };
  } else {
    // an inline curve's power is taken as its powerBasis says, as at the operating point
    kept = { pump: { fit: fitInlinePump(body.units, spec, '/body/keep/pump') }, pumpId: null, motorEfficiency: 1 };
  }
  if (kept.pump.fit.flowMin !== 0)
    throw unprocessable(
      '/body/keep/pump',
      'must have a curve that starts at zero flow (its shut-off head) to run in parallel with another model',
    );
  return kept;
}

function setPointAnswer(point: MixedSetPoint, keptPumpId: number | null, addedPumpId: number, body: SelectionRequest) {
  const to = answerUnits(body.units);
  return {
    flow: to.flow(point.flow),
    head: to.head(point.head),
    inputPower: point.inputPower === null ? null : to.power(point.inputPower),
    pumps: point.members.map(({ entry, point: member }) => ({
      role: entry === 0 ? ('kept' as const) : ('added' as const),
      pumpId: entry === 0 ? keptPumpId : addedPumpId,
      flow: to.flow(member.flowPerPump),
      head: to.head(member.head),
      percentOfBep: member.percentOfBep,
      region: member.region,
      efficiency: member.efficiency === null ? null : member.efficiency * 100,
      inputPower: member.inputPower === null ? null : to.power(member.inputPower),
    })),
  };
}

/** A candidate's kept set in the request's units. */
export function keptSetAnswer(
  set: KeptSetDuty,
  keptPumpId: number | null,
  addedPumpId: number,
  body: SelectionRequest,
): KeptSetPoint {
  const to = answerUnits(body.units);
  return {
    ...setPointAnswer(set.point, keptPumpId, addedPumpId, body),
    stopped: set.stopped.map(({ role, point, meetsMinimum }) => ({
      stopped: role,
      flow: point === null ? null : to.flow(point.flow),
      head: point === null ? null : to.head(point.head),
      meetsMinimum,
    })),
  };
}
