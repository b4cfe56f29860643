import { expect } from 'chai';
import {
  FITTINGS,
  FITTING_KINDS,
  HydraulicsInputError,
  craneFullyTurbulentFrictionFactor,
  fittingK,
  pipeSizeById,
  type FittingKind,
} from '../../shared/hydraulics';
import { type CraneValues, type FluidsAnswer, fluidsReference } from './reference/fluids-reference';
import { refusalOf } from '../support/engine-refusal';

/** Crane K in python3-fluids for each catalogue kind (fluids.fittings). */
const FLUIDS_NAME: Partial<Record<FittingKind, keyof CraneValues>> = {
  'elbow-90-standard': 'elbow90',
  'elbow-90-long-radius': 'bend90rd1',
  'elbow-45-standard': 'elbow45',
  'bend-180-return': 'return180',
  'valve-gate': 'gate',
  'valve-ball': 'ball',
  'valve-globe': 'globe',
  'valve-butterfly': 'butterfly',
  'check-valve-swing': 'swingCheck',
  'check-valve-swing-clearway': 'swingCheckClearway',
  'foot-valve-poppet': 'footValvePoppet',
  'foot-valve-hinged': 'footValveHinged',
  'entrance-sharp': 'entranceSharp',
  'entrance-inward-projecting': 'entranceInward',
  exit: 'exit',
};

/**
 * Our f_T is Crane's closed form 0.25/[log10(eps/3.7D)]^2; fluids' ft_Crane
 * solves Colebrook at Re = 7.5e6 D with its own steel roughness. They agree
 * within 1.5 % from 1/2" to 8".
 */
const FT_TOLERANCE = 0.015;

describe('fittings catalogue', () => {
  const sizes = ['0.5', '1', '1.5', '2', '3', '4', '6', '8'].map((nominal) => pipeSizeById(`pvc-sch40-${nominal}`));
  let reference: FluidsAnswer;
  before(() => {
    reference = fluidsReference({ crane: sizes.map((size) => size.insideDiameter) });
  });

  it('f_T agrees with python3-fluids ft_Crane within 1.5 % for 1/2" to 8"', () => {
    sizes.forEach((size, index) => {
      const expected = reference.crane[index].ft;
      expect(craneFullyTurbulentFrictionFactor(size.insideDiameter), size.id).to.be.closeTo(
        expected,
        FT_TOLERANCE * expected,
      );
    });
  });

  it('uses the same multiples of f_T as python3-fluids (exact) and so the same K within the f_T tolerance', () => {
    sizes.forEach((size, index) => {
      const values = reference.crane[index];
      for (const [kind, name] of Object.entries(FLUIDS_NAME) as [FittingKind, keyof CraneValues][]) {
        const fitting = FITTINGS.find((entry) => entry.kind === kind);
        const expected = values[name];
        if (fitting?.resistance.method === 'crane') {
          expect(expected / values.ft, `${kind} at ${size.id}`).to.be.closeTo(fitting.resistance.multiplier, 1e-9);
        }
        expect(fittingK(kind, size.insideDiameter), `${kind} at ${size.id}`).to.be.closeTo(
          expected,
          FT_TOLERANCE * expected,
        );
      }
    });
  });

  it('tees use the older fixed Crane values, 20 f_T run and 60 f_T branch (fluids has only the 2009 flow-ratio method)', () => {
    sizes.forEach((size, index) => {
      const ft = reference.crane[index].ft;
      expect(fittingK('tee-run', size.insideDiameter)).to.be.closeTo(20 * ft, FT_TOLERANCE * 20 * ft);
      expect(fittingK('tee-branch', size.insideDiameter)).to.be.closeTo(60 * ft, FT_TOLERANCE * 60 * ft);
    });
  });

  it('lists every kind once, each with its source', () => {
    expect(FITTINGS.map((fitting) => fitting.kind)).to.deep.equal([...FITTING_KINDS]);
    for (const fitting of FITTINGS) {
      expect(fitting.source).to.match(/Crane TP-410/);
    }
  });

  it('rejects an unknown kind naming the valid kinds', () => {
    const unknown = refusalOf(() => fittingK('elbow-90-mitre', 0.05, '/segments/0/fittings/3/kind'));
    expect(unknown).to.deep.include({ code: 'unknown-fitting-kind', pointer: '/segments/0/fittings/3/kind' });
    expect(unknown.params).to.deep.include({ value: 'elbow-90-mitre' });
    expect((unknown.params as { accepted: string[] }).accepted).to.include('elbow-90-standard');
    expect(() => fittingK('valve-gate', 0)).to.throw(HydraulicsInputError);
    expect(refusalOf(() => fittingK('valve-gate', 0))).to.deep.include({
      code: 'not-positive',
      params: { what: 'inside diameter', value: 0 },
    });
  });
});
