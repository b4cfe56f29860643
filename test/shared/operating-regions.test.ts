import { expect } from 'chai';
import {
  DEFAULT_PREFERRED_BAND,
  HydraulicsInputError,
  checkPreferredBand,
  classifyOperatingRegion,
  preferredFlowRegion,
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

  it("puts the supplier's declared preferred range before the band, with or without a BEP", () => {
    const declared = { flowMin: 0.005, flowMax: 0.006 };
    const withAor = { ...fit, allowableRegion: { flowMin: 0.004, flowMax: 0.013 } };
    expect(classifyOperatingRegion(withAor, 0.0055, DEFAULT_PREFERRED_BAND, declared).region).to.equal('preferred');
    expect(classifyOperatingRegion(withAor, 0.01, DEFAULT_PREFERRED_BAND, declared).region).to.equal('allowable');
    expect(classifyOperatingRegion(fit, 0.01, DEFAULT_PREFERRED_BAND, declared).region).to.equal('outside');
    expect(
      classifyOperatingRegion({ bep: null, allowableRegion: null }, 0.0055, DEFAULT_PREFERRED_BAND, declared),
    ).to.deep.equal({ region: 'preferred', percentOfBep: null });
  });

  it('gives the preferred region in flow, kept inside the published flows', () => {
    const published = { bep: { flow: 0.01 }, flowMin: 0, flowMax: 0.02 };
    const region = preferredFlowRegion(published)!;
    expect(region.flowMin).to.be.closeTo(0.007, 1e-12);
    expect(region.flowMax).to.be.closeTo(0.012, 1e-12);
    expect(preferredFlowRegion({ ...published, flowMin: 0.008, flowMax: 0.011 })).to.deep.equal({
      flowMin: 0.008,
      flowMax: 0.011,
    });
    expect(preferredFlowRegion({ ...published, flowMax: 0.006 })).to.equal(null);
    expect(preferredFlowRegion({ ...published, bep: null })).to.equal(null);
    const declared = { flowMin: 0.001, flowMax: 0.03 };
    expect(preferredFlowRegion({ ...published, bep: null }, DEFAULT_PREFERRED_BAND, declared)).to.equal(declared);
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
