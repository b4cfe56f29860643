import { expect } from 'chai';
import type { DesignSearch, DesignSystem } from '../../shared/api/api-schemas';
import {
  DESIGN_UNITS,
  designPipeSystem,
  designSelectionRequest,
  designStaticHead,
} from '../../shared/api/design-system';

/*
 * The one mapping of a design to the calculations' system, used by the design pages, proposals and
 * project history alike: these are the choices it makes (our own rules, not a reference).
 */

const system: DesignSystem = {
  staticMode: 'levels',
  staticHead: 999,
  intakeLevel: 100,
  dischargeLevel: 114.5,
  outletPressureHead: 0,
  waterTemperatureC: 20,
  frictionMethod: 'hazen-williams',
  segments: [
    {
      series: 'pvc-sch40',
      size: 'pvc-sch40-3',
      length: 240,
      extraK: 2,
      fittings: [
        { kind: 'elbow-90-standard', count: 4 },
        { kind: 'valve-ball', count: 0 },
      ],
    },
    {
      series: 'pvc-sch40',
      size: 'pvc-sch40-2',
      length: 10,
      extraK: 0,
      fittings: [],
      insideDiameter: 1.9,
      hazenWilliamsC: 140,
      equipment: [{ name: 'UV clarifier', headLoss: 1.5, atFlow: 60 }],
    },
  ],
};

describe('a design as the calculations take it', () => {
  it('takes the static head from the two levels in levels mode, and as typed otherwise', () => {
    expect(designStaticHead(system)).to.equal(14.5);
    expect(designStaticHead({ ...system, staticMode: 'direct' })).to.equal(999);
  });

  it('sends the size, leaves fittings counted zero out, and keeps the extra K', () => {
    const [first] = designPipeSystem(system).segments;
    expect(first).to.deep.equal({
      length: 240,
      pipe: 'pvc-sch40-3',
      fittings: [{ kind: 'elbow-90-standard', count: 4 }],
      minorLossK: 2,
    });
  });

  it('sends a custom bore with the series material instead of the size, with its C and equipment', () => {
    const second = designPipeSystem(system).segments[1];
    expect(second).to.deep.equal({
      length: 10,
      insideDiameter: 1.9,
      material: 'pvc',
      hazenWilliamsC: 140,
      fittings: [],
      minorLossK: 0,
      equipment: [{ name: 'UV clarifier', headLoss: 1.5, atFlow: 60 }],
    });
  });

  it('states each unit system in full', () => {
    expect(DESIGN_UNITS.us).to.deep.equal({ flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' });
    expect(DESIGN_UNITS.si).to.deep.equal({ flow: 'L/min', head: 'm', length: 'm', diameter: 'mm', power: 'kW' });
  });

  describe('the search of a design with a kept pump', () => {
    const search: DesignSearch = {
      arrangements: [1, 2],
      requireOneFailed: true,
      standby: true,
      onlyPreferredRegion: false,
      maxInputPowerPerPump: null,
      hoursPerDay: 24,
      tariffPerKWh: null,
      limit: 20,
    };
    const design = { unitSystem: 'us' as const, system, band: { flowMin: 90, flowMax: 130 }, search };

    it('sends keep with one added pump and no standby', () => {
      const body = designSelectionRequest({ ...design, search: { ...search, keepPumpId: 7 } });
      expect(body.keep).to.deep.equal({ pump: { pumpId: 7 } });
      expect(body.arrangements).to.deep.equal([1]);
      expect(body.standby).to.equal(false);
    });

    it('leaves a design without one as it was', () => {
      for (const keepPumpId of [undefined, null]) {
        const body = designSelectionRequest({ ...design, search: { ...search, keepPumpId } });
        expect(body).to.not.have.property('keep');
        expect(body.arrangements).to.deep.equal([1, 2]);
        expect(body.standby).to.equal(true);
      }
    });
  });
});
