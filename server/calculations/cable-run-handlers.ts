import type { RequestHandler } from 'express';
import type { CableDropAnswer, CableRunRequest, CableRunResponse } from '../../shared/api/api-schemas';
import {
  cableVoltageDrop,
  conductorById,
  DEFAULT_CONDUCTOR_TEMPERATURE,
  DEFAULT_MAX_DROP_PERCENT,
  smallestConductorForDrop,
  type CableDrop,
  type CableRun,
  type ConductorSeries,
} from '../../shared/electrical';
import { HydraulicsInputError, lengthToSI } from '../../shared/hydraulics';
import { CABLE_RUN_CAUTION } from '../../shared/messages/design-cautions';
import { engineInputErrorText } from '../../shared/messages/engine-issue-text';
import { ProblemError } from '../api/problem-details';
import { unprocessable, withRequestPointers } from './engine-problem';

/*
 * POST /calculations/cable-run: the voltage drop of the copper run to a pump at its full-load
 * current, and the smallest conductor of each series under the limit (shared/electrical).
 */

/** Where the cable run finds a catalog pump's motor rating. */
export interface PumpElectricalRatings {
  findPump(
    pumpId: number,
  ): Promise<
    { electrical: { fullLoadCurrent: number | null; voltage: number | null; phases: number | null } } | undefined
  >;
}

const ratingFields = ['current', 'voltage', 'phases'] as const;

/** The run's current, voltage and phases from the request or from the catalog pump it names. */
async function ratingOf(
  body: CableRunRequest,
  pumps: PumpElectricalRatings,
): Promise<{ current: number; voltage: number; phases: number; fromPump: boolean }> {
  if (body.pumpId === undefined) {
    const missing = ratingFields.find((field) => body[field] === undefined);
    if (missing)
      throw unprocessable(`/body/${missing}`, 'is needed: give current, voltage and phases, or a catalog pumpId');
    return { current: body.current!, voltage: body.voltage!, phases: body.phases!, fromPump: false };
  }
  const given = ratingFields.find((field) => body[field] !== undefined);
  if (given)
    throw unprocessable(`/body/${given}`, 'comes from the catalog when pumpId is given: give one or the other');
  const pump = await pumps.findPump(body.pumpId);
  if (!pump)
    throw new ProblemError(404, 'Pump not found', `No pump with a current curve has id ${body.pumpId}`, [
      { pointer: '/body/pumpId', detail: 'no pump with a current curve has this id' },
    ]);
  const { fullLoadCurrent, voltage, phases } = pump.electrical;
  if (fullLoadCurrent === null || voltage === null || phases === null) {
    const lacking = [
      fullLoadCurrent === null ? 'full-load current' : null,
      voltage === null ? 'voltage' : null,
      phases === null ? 'phases' : null,
    ].filter((word) => word !== null);
    throw unprocessable(
      '/body/pumpId',
      `names a pump whose curve table gives no ${lacking.join(', ')}: give current, voltage and phases instead`,
    );
  }
  return { current: fullLoadCurrent, voltage, phases, fromPump: true };
}

function dropAnswer(drop: CableDrop, maxDropPercent: number): CableDropAnswer {
  const { conductor } = drop;
  return {
    conductor: { id: conductor.id, label: conductor.label, series: conductor.series, areaMm2: conductor.area * 1e6 },
    volts: drop.volts,
    percent: drop.percent,
    withinLimit: drop.percent <= maxDropPercent,
  };
}

export function createCableRunHandlers(pumps: PumpElectricalRatings): Record<'calculateCableRun', RequestHandler> {
  return {
    calculateCableRun: async (request, response) => {
      const body = request.body as CableRunRequest;
      const rating = await ratingOf(body, pumps);
      const maxDropPercent = body.maxDropPercent ?? DEFAULT_MAX_DROP_PERCENT;
      // the engine names its own inputs; a rating from the catalog is the pump's, not the request's
      const pointerOf = (field: string) =>
        rating.fromPump && ['/current', '/voltage', '/phases'].includes(field) ? '/body/pumpId' : `/body${field}`;
      const run = withRequestPointers(
        (): CableRun => ({
          current: rating.current,
          voltage: rating.voltage,
          phases: rating.phases as CableRun['phases'],
          length: lengthToSI(body.length, body.units.length, '/length'),
        }),
        pointerOf,
      );
      const given =
        body.conductor === undefined ? null : withRequestPointers(() => conductorById(body.conductor!), pointerOf);
      const warnings: string[] = [];
      const smallestOf = (series: ConductorSeries): CableDropAnswer | null => {
        try {
          return dropAnswer(smallestConductorForDrop(series, run, maxDropPercent), maxDropPercent);
        } catch (error) {
          if (!(error instanceof HydraulicsInputError) || error.issue.code !== 'no-conductor-meets-limit') throw error;
          warnings.push(engineInputErrorText(error.issue));
          return null;
        }
      };
      const [awg, metric] = withRequestPointers(() => [smallestOf('awg'), smallestOf('metric')], pointerOf);
      if (awg === null && metric === null) throw unprocessable('/body/length', warnings.join('; '));
      const answer: CableRunResponse = {
        units: { length: body.units.length },
        ...(body.pumpId === undefined ? {} : { pumpId: body.pumpId }),
        current: rating.current,
        voltage: rating.voltage,
        phases: run.phases,
        length: body.length,
        maxDropPercent,
        conductorTemperatureC: DEFAULT_CONDUCTOR_TEMPERATURE,
        conductor: given === null ? null : dropAnswer(cableVoltageDrop(run, given), maxDropPercent),
        smallest: { awg, metric },
        warnings,
        caution: { ...CABLE_RUN_CAUTION },
      };
      response.json(answer);
    },
  };
}
