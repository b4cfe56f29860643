import { expect } from 'chai';
import {
  checkPlausible,
  checkPlausibleInUnits,
  PLAUSIBLE_LIMITS,
  plausibilityMessage,
  SI_PLAUSIBLE_UNITS,
} from '../../shared/hydraulics';

const us = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' } as const;
const metric = { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' } as const;

describe('plausibility limits', () => {
  it('passes the limit itself and refuses beyond it, with a code and the bound', () => {
    expect(checkPlausible('staticHead', 500)).to.equal(null);
    expect(checkPlausible('staticHead', -500)).to.equal(null);
    expect(checkPlausible('staticHead', 500.001)).to.deep.equal({
      code: 'above-plausible-max',
      limit: 'staticHead',
      bound: 500,
    });
    expect(checkPlausible('insideDiameter', 0.0029)).to.deep.equal({
      code: 'below-plausible-min',
      limit: 'insideDiameter',
      bound: 0.003,
    });
  });

  it('has no floor where the engine checks the sign', () => {
    expect(PLAUSIBLE_LIMITS.pumpCurveHead.min).to.equal(null);
    expect(checkPlausible('pumpCurveHead', -5)).to.equal(null);
  });

  it('reads a value in the user units (1 ft = 0.3048 m exactly)', () => {
    // 1640 ft = 499.87 m passes; 1641 ft = 500.18 m does not
    expect(checkPlausibleInUnits('staticHead', 1640, us)).to.equal(null);
    expect(checkPlausibleInUnits('staticHead', 1641, us)?.code).to.equal('above-plausible-max');
  });

  it('states the limit in the user units, rounded to a figure that passes', () => {
    const violation = checkPlausible('staticHead', 600)!;
    expect(plausibilityMessage(violation, us)).to.equal('static head must be at most 1640 ft');
    expect(plausibilityMessage(violation, metric)).to.equal('static head must be at most 500 m');
    expect(plausibilityMessage(checkPlausible('insideDiameter', 0.001)!, us)).to.equal(
      'inside diameter must be at least 0.1182 in',
    );
    expect(plausibilityMessage(checkPlausible('flow', 11)!, SI_PLAUSIBLE_UNITS)).to.equal(
      'flow must be at most 10 m3/s',
    );
  });
});
