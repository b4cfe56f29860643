import { expect } from 'chai';
import {
  DEFAULT_PREFERRED_BAND,
  HydraulicsInputError,
  checkPreferredBand,
  classifyOperatingRegion,
} from '../../shared/hydraulics';

const fit = { bep: { flow: 0.01, head: 10, efficiency: 0.7 }, allowableRegion: null };

describe('operating regions', () => {
  it('defaults to a preferred band of 70-120 % of BEP flow (ANSI/HI 9.6.3)', () => {
    expect(DEFAULT_PREFERRED_BAND).to.deep.equal({ minPercent: 70, maxPercent: 120 });
    expect(classifyOperatingRegion(fit, 0.007).region).to.equal('preferred');
    expect(classifyOperatingRegion(fit, 0.012).region).to.equal('preferred');
    expect(classifyOperatingRegion(fit, 0.0069).region).to.equal('outside');
    expect(classifyOperatingRegion(fit, 0.0121).region).to.equal('outside');
    expect(classifyOperatingRegion(fit, 0.0085).percentOfBep).to.be.closeTo(85, 1e-9);
  });

  it("uses the supplier's allowable region outside the preferred band", () => {
    const withAor = { ...fit, allowableRegion: { flowMin: 0.004, flowMax: 0.013 } };
    expect(classifyOperatingRegion(withAor, 0.005).region).to.equal('allowable');
    expect(classifyOperatingRegion(withAor, 0.0125).region).to.equal('allowable');
    expect(classifyOperatingRegion(withAor, 0.0135).region).to.equal('outside');
    expect(classifyOperatingRegion(withAor, 0.01).region).to.equal('preferred');
  });

  it('takes a narrower configured band (e.g. 80-115 % for high specific speed)', () => {
    const band = checkPreferredBand({ minPercent: 80, maxPercent: 115 });
    expect(classifyOperatingRegion(fit, 0.0075, band).region).to.equal('outside');
    expect(classifyOperatingRegion(fit, 0.0114, band).region).to.equal('preferred');
  });

  it('says unknown-bep when the fit has no BEP', () => {
    expect(classifyOperatingRegion({ bep: null, allowableRegion: null }, 0.01)).to.deep.equal({
      region: 'unknown-bep',
      percentOfBep: null,
    });
  });

  it('rejects an inverted or non-positive band', () => {
    expect(() => checkPreferredBand({ minPercent: 120, maxPercent: 70 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/preferredBand/maxPercent');
    expect(() => checkPreferredBand({ minPercent: 0, maxPercent: 70 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/preferredBand/minPercent');
  });
});
