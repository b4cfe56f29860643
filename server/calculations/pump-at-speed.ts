import type { CalculationUnits, PumpSpeedAnswer, PumpSpeedRequest } from '../../shared/api/api-schemas';
import {
  LOW_SPEED_CAUTION_RATIO,
  MAX_SPEED_RATIO,
  polynomialValue,
  pumpCurveAtSpeed,
  speedRatioAllowed,
  type EngineIssue,
  type PumpSpeeds,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';
import type { PumpOnFile } from './arrangement-duty';
import { unprocessable } from './engine-problem';
import { answerUnits, requestValueText } from './request-units';

/*
 * A pump at another speed than its nominal one (a drive, a controller, a multi-speed motor), by the
 * affinity laws: Q ~ N, H ~ N^2, P ~ N^3, efficiency held at similar points (F. M. White, Fluid
 * Mechanics, 7th ed. (2011), section 11.4; I. J. Karassik et al., Pump Handbook, 4th ed. (2008),
 * affinity laws). Their limits, from memory of the handbook's discussion and common practice,
 * not checked here: they hold well for moderate speed changes of one pump; well below some 50-60 %
 * of speed the efficiency falls (losses such as disc friction and leakage do not scale with N,
 * and the motor and drive lose efficiency at part load), a motor cooled by its own fan runs hot,
 * and on a system with static head the point runs towards shut-off, under the pump's minimum
 * flow. Hence the `low-speed` caution below LOW_SPEED_CAUTION_RATIO, and no scaling above
 * MAX_SPEED_RATIO.
 */

/** The speed a request asks for, as the engine takes it. */
export interface SpeedAsked {
  /** N / N_nominal */
  ratio: number;
  /** rpm, or null when the nominal speed is not known */
  rpm: number | null;
  nominalRpm: number | null;
}

function speedsText(speeds: PumpSpeeds): string {
  const nominal = `${speeds.nominalRpm} rpm`;
  const range = speeds.rangeRpm ? `${speeds.rangeRpm.min}-${speeds.rangeRpm.max} rpm` : null;
  const fixed = speeds.fixedRpm?.length ? `${speeds.fixedRpm.join(', ')} rpm` : null;
  return [range, fixed, range || fixed ? null : `only its nominal ${nominal}`].filter(Boolean).join(' or ');
}

/**
 * The speed `speed` asks of a pump whose speeds are `speeds` (a catalog pump's, `catalog` true; or
 * an inline curve's nominal speed only). Every problem is a 422 naming the field: neither or both
 * of ratio and rpm, rpm without a nominal speed, a ratio above MAX_SPEED_RATIO, and for a catalog
 * pump a speed outside its range and fixed speeds.
 */
export function speedAsked(speed: PumpSpeedRequest, speeds: PumpSpeeds, catalog: boolean): SpeedAsked {
  if (speed.ratio === undefined && speed.rpm === undefined)
    throw unprocessable('/body/speed', 'give ratio (N / N_nominal) or rpm');
  if (speed.ratio !== undefined && speed.rpm !== undefined)
    throw unprocessable('/body/speed/rpm', 'give ratio or rpm, not both');
  const nominal = speeds.nominalRpm;
  const pointer = speed.ratio === undefined ? '/body/speed/rpm' : '/body/speed/ratio';
  if (speed.rpm !== undefined && nominal === null)
    throw unprocessable(
      pointer,
      catalog
        ? 'needs the nominal speed, which the catalog does not give for this pump: ask for a ratio'
        : 'needs the nominal speed of the curve (pump.speedRpm): give it, or ask for a ratio',
    );
  const ratio = speed.ratio ?? speed.rpm! / nominal!;
  const rpm = nominal === null ? null : ratio * nominal;
  if (!(ratio > 0) || ratio > MAX_SPEED_RATIO)
    throw unprocessable(
      pointer,
      `must be above 0 and at most ${MAX_SPEED_RATIO} times the nominal speed` +
        (nominal === null ? '' : ` (${Math.floor(MAX_SPEED_RATIO * nominal)} rpm)`),
    );
  if (catalog && !speedRatioAllowed(speeds, ratio))
    throw unprocessable(
      pointer,
      nominal === null
        ? 'the catalog gives this pump no nominal speed, so it runs at ratio 1 only'
        : `${Number((rpm as number).toFixed(1))} rpm is not a speed of this pump: it runs at ${speedsText(speeds)}`,
    );
  return { ratio, rpm, nominalRpm: nominal };
}

/**
 * The pump moved to `ratio` by the affinity laws (pumpCurveAtSpeed); the supplier's declared
 * preferred flows move with it (Q ~ N), as the fit's own regions do.
 */
export function pumpOnFileAtSpeed<T extends PumpOnFile>(pump: T, ratio: number): T {
  const declared = pump.declaredPreferred;
  return {
    ...pump,
    fit: pumpCurveAtSpeed(pump.fit, ratio),
    declaredPreferred: declared ? { flowMin: declared.flowMin * ratio, flowMax: declared.flowMax * ratio } : declared,
  };
}

/** The caution a point at `ratio` carries: below LOW_SPEED_CAUTION_RATIO (see the note at the top). */
export function lowSpeedIssue(ratio: number): EngineIssue | null {
  return ratio < LOW_SPEED_CAUTION_RATIO
    ? { code: 'low-speed', params: { speedRatio: ratio, cautionRatio: LOW_SPEED_CAUTION_RATIO } }
    : null;
}

/** The sentence of lowSpeedIssue in the request's units, or null. */
export function lowSpeedWarning(ratio: number, units: CalculationUnits): string | null {
  const issue = lowSpeedIssue(ratio);
  return issue ? engineIssueText(issue, requestValueText(units)) : null;
}

/** The answer's `speed`: the speed used and the head curve at it, sampled at 11 flows, in the request's units. */
export function speedAnswer(asked: SpeedAsked, pumpAtSpeed: PumpOnFile, units: CalculationUnits): PumpSpeedAnswer {
  const to = answerUnits(units);
  const { fit } = pumpAtSpeed;
  return {
    ratio: asked.ratio,
    rpm: asked.rpm,
    nominalRpm: asked.nominalRpm,
    curve: Array.from({ length: 11 }, (_, step) => {
      const flow = fit.flowMin + ((fit.flowMax - fit.flowMin) * step) / 10;
      return { flow: to.flow(flow), head: to.head(polynomialValue(fit.headCoefficients, flow)) };
    }),
    cautions: lowSpeedIssue(asked.ratio) ? ['low-speed'] : [],
  };
}
