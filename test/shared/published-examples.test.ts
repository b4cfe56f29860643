import { expect } from 'chai';
import { leastSquaresPolynomial } from '../../shared/hydraulics/least-squares';
import { quadraticSystem } from './quadratic-system';
import {
  compileSystemCurve,
  diameterToSI,
  fitPumpCurve,
  flowFromSI,
  flowToSI,
  headFromSI,
  headLossDarcyWeisbach,
  headToSI,
  hydraulicPower,
  pumpCurveAtSpeed,
  pumpHeadAt,
  scaleBySpeed,
  solveOperatingPoint,
} from '../../shared/hydraulics';
import { engineIssueText } from '../../shared/messages/engine-issue-text';

/*
 * Worked examples whose data AND answers are published, each checked against
 * the engine. Data are restated, not quoted; each tolerance follows how the
 * source rounded its answer.
 *
 * Sources (read from):
 * [HI-A] Hydraulic Institute, HI Data Tool (Engineering Data Library),
 *   Pump Fundamentals, "A) System Curves", Worked Example (Calc. 1.A.1-1.A.3).
 *   Page source read at github.com/hydraulic-institute/edb,
 *   source/01_pump-fundamentals/01_sys-curves.md.
 * [HI-C] Same publication, "C) Combined Pump & System Curves" (later edition
 *   "I) Operating Point"), Worked Example, Tbl. 1.C.1, Eq. 1.C.12, Calc. 1.C.13.
 *   Read at source/01_pump-fundamentals/03_combined.md and
 *   source/02_pump-system-fundamentals/09_operating-point-Phase3.md, pump
 *   table source/01_pump-fundamentals/table-data/qdH-us.csv.
 * [HI-B] Same publication, "B) Pump Curves" / "D) Rotodynamic Pump Curves",
 *   Worked Example 1 (affinity rules, speed change), Tbl. 1.B.1, Calc.
 *   1.B.6a(1)-(4), 1.B.6b(1)-(3), Tbl. 1.B.2. Read at
 *   source/01_pump-fundamentals/02_pump-curves.md,
 *   source/02_pump-system-fundamentals/04_rotodynamic-pump-curves-Phase3.md,
 *   tables .../table-data/total-head-feet.csv and total-head-feet-2.csv.
 * [DOE] U.S. Department of Energy, DOE Fundamentals Handbook: Thermodynamics,
 *   Heat Transfer, and Fluid Flow, DOE-HDBK-1012/3-92, Vol. 3, Module 3
 *   Fluid Flow, "Centrifugal Pumps", Example: Pump Laws (page HT-03 p. 50).
 *   Read at nuclearpowertraining.tpub.com/h1012v3/css/Net-Positive-Suction-Head-72.htm.
 * [UNLV] University of Nevada, Las Vegas, CEM 350 Facilities Design I,
 *   Module 7 Piping Equipment and Systems, calculation examples 2 and 3.
 *   Read at courses.online.unlv.edu/courses/CEM/CEM350/module-7-accordion.
 * [EM] E. P. Maurer, R package "hydraulics" 0.7.0 (CRAN), vignette
 *   "hydraulics_vignette", section 6.0 "Pump Curve and Operating Points",
 *   printed output. Read at github.com/EdM44/hydraulics,
 *   docs/articles/hydraulics_vignette.html, with R/pumpcurve.R (the fit) and
 *   R/darcy_weisbach.R (g = 32.2 ft/s2 in US units).
 */

const gpm = (value: number) => flowToSI(value, 'gpm');
const ft = (value: number) => headToSI(value, 'ft');
const CUBIC_FOOT = 0.3048 ** 3; // m3, from the international foot (NIST SP 811)
const WATER_HORSEPOWER_WATTS = 745.69987; // 1 hp = 550 ft lbf/s (NIST SP 811)

describe('published worked examples', () => {
  describe('[HI-A] system curve of the worked example: 265 ft static, 1255 ft of 4 in Sch 40, f = 0.02, sum K = 3.79', () => {
    // Given: tank levels 24 ft and 289 ft; 4 in Sch 40 steel, bore 4.026 in; 1255 ft of pipe at a
    // constant f = 0.02; two flanged elbows, swing check, gate valve, sudden enlargement, K 3.79 in all.
    // Stated: dh_system = 265 ft + 7.75e-4 Q^2 (Q in gpm), 296 ft at 200 gpm.
    const bore = diameterToSI(4.026, 'in');
    // the constant friction factor makes the pipe one K = f L / D (the source's assumption)
    const pipeK = (0.02 * 1255) / (4.026 / 12);
    const system = compileSystemCurve({
      staticHead: ft(289 - 24),
      frictionMethod: 'hazen-williams',
      // the whole resistance as K on a segment of negligible length (its own friction < 1e-9 m)
      segments: [{ length: 1e-9, insideDiameter: bore, hazenWilliamsC: 150, extraK: pipeK + 3.79 }],
    });

    it('has the stated coefficient 7.75e-4 ft/gpm^2 (3 significant figures) and 296 ft at 200 gpm', () => {
      const coefficient = (headFromSI(system.evaluate(gpm(200)), 'ft') - 265) / 200 ** 2;
      // the source takes g = 32.2 ft/s2, the engine 9.80665 m/s2 (32.174): 0.08 % apart
      expect(coefficient).to.be.closeTo(7.75e-4, 0.005 * 7.75e-4);
      expect(headFromSI(system.evaluate(gpm(200)), 'ft')).to.be.closeTo(296, 0.5);
    });

    describe('[HI-C] operating point with the tabulated pump curve, fitted and solved', () => {
      // Given (Tbl. 1.C.1): 0 gpm 380 ft, 150 gpm 330.5 ft, 200 gpm 296 ft, 300 gpm 200 ft.
      // Stated: second-order fit 380 - 0.06 Q - 0.0018 Q^2 (Eq. 1.C.12); operating point 200 gpm and 296 ft.
      const table: Array<[number, number]> = [
        [0, 380],
        [150, 330.5],
        [200, 296],
        [300, 200],
      ];
      const fit = fitPumpCurve(table.map(([q, h]) => ({ flow: gpm(q), head: ft(h) })));

      it('fits the table as the stated polynomial 380 - 0.06 Q - 0.0018 Q^2', () => {
        for (const q of [0, 50, 100, 250]) {
          expect(headFromSI(pumpHeadAt(fit, gpm(q)), 'ft')).to.be.closeTo(380 - 0.06 * q - 0.0018 * q * q, 0.05);
        }
      });

      it('operates at the stated 200 gpm and 296 ft (answers to 3 significant figures: 0.5 %)', () => {
        const point = solveOperatingPoint(JSON.parse(JSON.stringify(fit)), system);
        if (!point.ok) throw new Error(engineIssueText(point.issue));
        expect(flowFromSI(point.flow, 'gpm')).to.be.closeTo(200, 1);
        expect(headFromSI(point.head, 'ft')).to.be.closeTo(296, 1.5);
      });

      it('moves to the stated 190.6 gpm when the tank rises 10 ft (static 275 ft; 4 figures, 0.25 %)', () => {
        const raised = compileSystemCurve({
          staticHead: ft(275),
          frictionMethod: 'hazen-williams',
          segments: [{ length: 1e-9, insideDiameter: bore, hazenWilliamsC: 150, extraK: pipeK + 3.79 }],
        });
        const point = solveOperatingPoint(fit, raised);
        if (!point.ok) throw new Error(engineIssueText(point.issue));
        expect(flowFromSI(point.flow, 'gpm')).to.be.closeTo(190.6, 0.5);
      });
    });
  });

  describe('[EM] operating point of a pump given as three points on a 20 in pipeline with 30 ft of static head', () => {
    // Given: K = h_f at 1 ft3/s through 3884 ft of 20 in pipe, ks 0.0005 ft, nu 1.23e-5 ft2/s (Colebrook),
    // held constant as h = 30 + K Q^2 (Q in ft3/s); printed "Coefficient K: 0.160".
    // Pump points 0, 5000, 7850 gpm at 81, 60, 20 ft, fitted as h = a + c Q^2 by least squares.
    // Stated: "Operating Point: Q = 12.051, h = 53.285" (ft3/s, ft).
    const diameter = ft(20 / 12);
    const length = ft(3884);
    const kinematicViscosity = 1.23e-5 * 0.3048 ** 2;
    const lossAtOneCfs = headLossDarcyWeisbach(length, CUBIC_FOOT, diameter, ft(0.0005), kinematicViscosity);

    it('has the stated system coefficient 0.160 ft per (ft3/s)^2 (3 decimals)', () => {
      expect(headFromSI(lossAtOneCfs, 'ft')).to.be.closeTo(0.16, 0.0005);
    });

    it('operates at the stated 12.051 ft3/s and 53.285 ft', () => {
      // the source's fit form, h = a + c Q^2 by least squares (R: lm(h ~ I(Q^2))), with the engine's routine
      const flows = [gpm(0), gpm(5000), gpm(7850)];
      const heads = [ft(81), ft(60), ft(20)];
      const pump = { headCoefficients: leastSquaresPolynomial(flows, heads, [0, 2]), flowMin: 0, flowMax: gpm(7850) };
      const system = quadraticSystem(ft(30), lossAtOneCfs / CUBIC_FOOT ** 2);
      const point = solveOperatingPoint(pump, system);
      if (!point.ok) throw new Error(engineIssueText(point.issue));
      // The source stops Colebrook and the intersection at R's default tolerance (about 1e-4) and takes
      // g = 32.2 ft/s2 against the engine's 9.80665 m/s2: together about 0.003 ft3/s and 0.01 ft here.
      expect(point.flow / CUBIC_FOOT).to.be.closeTo(12.051, 0.005);
      expect(headFromSI(point.head, 'ft')).to.be.closeTo(53.285, 0.015);
    });
  });

  describe('[HI-B] affinity rules: booster pump slowed 10 % from 1740 to 1566 rpm', () => {
    // Given (Tbl. 1.B.1), gpm and ft at 1740 rpm.
    const fullSpeed: Array<[number, number]> = [
      [0, 213],
      [200, 206],
      [400, 198],
      [600, 190],
      [800, 183],
      [1000, 176],
      [1200, 168],
      [1400, 159],
      [1600, 147],
      [1800, 135],
      [2000, 117],
      [2200, 98],
    ];
    // Stated at 1566 rpm (Tbl. 1.B.2), heads rounded to whole feet. Two rows of the published table
    // are not the affinity image of their full-speed rows and are left out: 1620 gpm is printed as
    // 108 ft (135 x 0.81 = 109.35) and 1980 gpm as 75 ft (98 x 0.81 = 79.38).
    const reducedSpeed: Array<[number, number]> = [
      [0, 173],
      [180, 167],
      [360, 160],
      [540, 154],
      [720, 148],
      [900, 143],
      [1080, 136],
      [1260, 129],
      [1440, 119],
      [1800, 95],
    ];
    const ratio = 1566 / 1740; // the source's n2 = 1740 (1 - 0.10)

    it('maps each tabulated point as stated (Calc. 1.B.6a/b: 200 -> 180, 400 -> 360 gpm; 213 -> 173, 206 -> 167, 198 -> 160 ft)', () => {
      const rows = new Map(fullSpeed);
      for (const [q, h] of reducedSpeed) {
        const fullFlow = Math.round(q / ratio);
        const fullHead = rows.get(fullFlow);
        if (fullHead === undefined) throw new Error(`no full-speed row for ${q} gpm`);
        const scaled = scaleBySpeed({ flow: gpm(fullFlow), head: ft(fullHead) }, ratio);
        expect(flowFromSI(scaled.flow, 'gpm')).to.be.closeTo(q, 0.5);
        expect(headFromSI(scaled.head, 'ft')).to.be.closeTo(h, 0.5); // whole feet
      }
    });

    it('gives the stated reduced-speed heads from the fitted full-speed curve moved by pumpCurveAtSpeed', () => {
      const fit = fitPumpCurve(fullSpeed.map(([q, h]) => ({ flow: gpm(q), head: ft(h) })));
      const slowed = pumpCurveAtSpeed(fit, ratio);
      const fitError = headFromSI(Math.abs(fit.statistics.worstResidual), 'ft') * ratio ** 2;
      for (const [q, h] of reducedSpeed) {
        expect(headFromSI(pumpHeadAt(slowed, gpm(q)), 'ft')).to.be.closeTo(h, 0.5 + fitError);
      }
    });
  });

  describe('[DOE] pump laws: cooling water pump at 1800 rpm, 400 gpm, 48 ft, 45 kW, sped up to 3600 rpm', () => {
    it('delivers the stated 800 gpm (exact ratio)', () => {
      const scaled = scaleBySpeed({ flow: gpm(400), head: ft(48), power: 45e3 }, 3600 / 1800);
      expect(flowFromSI(scaled.flow, 'gpm')).to.be.closeTo(800, 1e-9);
    });
  });

  describe('[UNLV] water horsepower: 100 gpm against 30 ft, SG 1.0', () => {
    // Stated: WHP = Q h SG / 3960 = 0.76 hp; BHP at 75 % pump efficiency = 1.0 hp (2 significant figures).
    const waterPower = hydraulicPower(gpm(100), ft(30), 1000);

    it('is the stated 0.76 hp', () => {
      expect(waterPower / WATER_HORSEPOWER_WATTS).to.be.closeTo(0.76, 0.005);
    });

    it('agrees with the customary Q H SG / 3960 to 0.2 % (3960 takes water at 62.4 lb/ft3)', () => {
      expect(waterPower / WATER_HORSEPOWER_WATTS).to.be.closeTo((100 * 30 * 1.0) / 3960, 0.002 * (3000 / 3960));
    });

    it('needs the stated 1.0 hp at the shaft at 75 % efficiency', () => {
      expect(waterPower / 0.75 / WATER_HORSEPOWER_WATTS).to.be.closeTo(1.0, 0.05);
    });
  });
});
