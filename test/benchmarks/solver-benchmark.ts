/*
 * Selection-search benchmark: one system, 10,000 stored pump fits. For every
 * pump it finds the operating point, classifies it against the preferred band
 * and works out input power and annual energy, as the selection search does
 * per request. A plain bisection on the same curves is measured in the same
 * run as the baseline. Prints figures only; nothing here asserts timing.
 *
 * Run: node --import tsx test/benchmarks/solver-benchmark.ts
 */
import {
  annualEnergy,
  classifyOperatingRegion,
  compileBranchedSystem,
  compileSystemCurve,
  fitPumpCurve,
  powerAtOperatingPoint,
  solveOperatingPoint,
  type CompiledSystemCurve,
  type PumpCurveFit,
  type SystemCurveInput,
} from '../../shared/hydraulics';
import { seededRandom } from '../../data-import/demo-data/seeded-random';

const PUMP_COUNT = 10_000;
const WARM_UP_ROUNDS = 30;
const MEASURED_ROUNDS = 40;
const HOURS_PER_DAY = 24;

/** Synthetic pond and waterfall pumps: 2-25 m shut-off, 1-40 m3/h, six published points with efficiency. */
function syntheticStoredFits(count: number): PumpCurveFit[] {
  const random = seededRandom(20240601);
  const fits: PumpCurveFit[] = [];
  while (fits.length < count) {
    const shutOff = 2 + 23 * random();
    const flowMax = (1 + 39 * random()) / 3600;
    const droop = 0.55 + 0.35 * random();
    const cubicShare = random();
    const bepAt = 0.45 + 0.3 * random();
    const peak = 0.3 + 0.45 * random();
    const points = [0, 0.2, 0.4, 0.6, 0.8, 1].map((x) => ({
      flow: x * flowMax,
      head: shutOff * (1 - droop * ((1 - cubicShare) * x * x + cubicShare * x * x * x)),
      efficiency: Math.max(0, peak * (2 * (x / bepAt) - (x / bepAt) ** 2)),
    }));
    // stored as JSON in the catalogue and reloaded without refitting
    fits.push(JSON.parse(JSON.stringify(fitPumpCurve(points))) as PumpCurveFit);
  }
  return fits;
}

interface Outcome {
  flows: Float64Array;
  checksum: number;
}

/** The selection search's per-pump work with Riffle's solver. */
function searchWithSolver(
  fits: readonly PumpCurveFit[],
  system: CompiledSystemCurve,
  density: number,
  out: Float64Array,
): number {
  let checksum = 0;
  for (let index = 0; index < fits.length; index += 1) {
    const fit = fits[index];
    const point = solveOperatingPoint(fit, system);
    if (!point.ok) {
      out[index] = -1;
      continue;
    }
    out[index] = point.flow;
    const band = classifyOperatingRegion(fit, point.flow);
    const power = powerAtOperatingPoint(fit, point.flow, point.head, density, { motor: 0.85 });
    checksum += annualEnergy(power.electrical ?? 0, HOURS_PER_DAY) + (band.region === 'preferred' ? 1 : 0);
  }
  return checksum;
}

function horner(coefficients: readonly number[], x: number): number {
  let value = 0;
  for (let power = coefficients.length - 1; power >= 0; power -= 1) {
    value = value * x + coefficients[power];
  }
  return value;
}

/** Baseline: the same work with plain bisection to the same tolerance (1e-12 of the curve's last flow). */
function searchWithBisection(
  fits: readonly PumpCurveFit[],
  system: CompiledSystemCurve,
  density: number,
  out: Float64Array,
): number {
  let checksum = 0;
  for (let index = 0; index < fits.length; index += 1) {
    const fit = fits[index];
    let lo = fit.flowMin;
    let hi = fit.flowMax;
    if (
      horner(fit.headCoefficients, lo) < system.evaluate(lo) ||
      horner(fit.headCoefficients, hi) > system.evaluate(hi)
    ) {
      out[index] = -1;
      continue;
    }
    const tolerance = 1e-12 * hi;
    while (hi - lo > tolerance) {
      const mid = 0.5 * (lo + hi);
      if (horner(fit.headCoefficients, mid) > system.evaluate(mid)) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    const flow = 0.5 * (lo + hi);
    out[index] = flow;
    const band = classifyOperatingRegion(fit, flow);
    const power = powerAtOperatingPoint(fit, flow, horner(fit.headCoefficients, flow), density, { motor: 0.85 });
    checksum += annualEnergy(power.electrical ?? 0, HOURS_PER_DAY) + (band.region === 'preferred' ? 1 : 0);
  }
  return checksum;
}

type Search = typeof searchWithSolver;

function measure(
  search: Search,
  fits: readonly PumpCurveFit[],
  system: CompiledSystemCurve,
  density: number,
): { medianMs: number; bestMs: number; outcome: Outcome } {
  const flows = new Float64Array(fits.length);
  let checksum = 0;
  for (let round = 0; round < WARM_UP_ROUNDS; round += 1) {
    checksum = search(fits, system, density, flows);
  }
  const times: number[] = [];
  for (let round = 0; round < MEASURED_ROUNDS; round += 1) {
    const start = performance.now();
    checksum = search(fits, system, density, flows);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return { medianMs: times[Math.floor(times.length / 2)], bestMs: times[0], outcome: { flows, checksum } };
}

const POND_SYSTEM: Omit<SystemCurveInput, 'frictionMethod'> = {
  staticHead: 4.4,
  outletPressureHead: 0.3,
  temperature: 15,
  segments: [
    {
      length: 2,
      pipeSizeId: 'pvc-flex-2',
      fittings: [
        { kind: 'entrance-sharp', count: 1 },
        { kind: 'check-valve-swing', count: 1 },
      ],
    },
    {
      length: 30,
      pipeSizeId: 'pvc-sch40-2',
      fittings: [
        { kind: 'elbow-90-standard', count: 4 },
        { kind: 'valve-ball', count: 1 },
      ],
    },
    {
      length: 6,
      pipeSizeId: 'pvc-sch40-1.5',
      fittings: [
        { kind: 'tee-branch', count: 1 },
        { kind: 'exit', count: 1 },
      ],
      extraK: 2,
    },
  ],
};

/** The same pond with its last segment split: falls 4.4 m up, a filter return 1.2 m up, each on its own pipe. */
const POND_WITH_TWO_BRANCHES = {
  temperature: POND_SYSTEM.temperature,
  segments: POND_SYSTEM.segments.slice(0, 2),
  branches: [
    { name: 'falls', staticHead: 4.4, outletPressureHead: 0.3, segments: POND_SYSTEM.segments.slice(2) },
    {
      name: 'filter return',
      staticHead: 1.2,
      segments: [{ length: 12, pipeSizeId: 'pvc-sch40-1.5', fittings: [{ kind: 'exit', count: 1 }], extraK: 6 }],
    },
  ],
};

/** One system's figures; `against` is the series route's median, for the per-pump cost of branches. */
function report(label: string, system: CompiledSystemCurve, fits: readonly PumpCurveFit[], against?: number): number {
  const density = 999.1;
  const solver = measure(searchWithSolver, fits, system, density);
  const bisection = measure(searchWithBisection, fits, system, density);
  let found = 0;
  let largestDifference = 0;
  for (let index = 0; index < fits.length; index += 1) {
    if (solver.outcome.flows[index] >= 0) {
      found += 1;
      largestDifference = Math.max(
        largestDifference,
        Math.abs(solver.outcome.flows[index] - bisection.outcome.flows[index]) / fits[index].flowMax,
      );
    }
  }
  console.log(`\n${label}`);
  console.log(`  pumps with an operating point: ${found} of ${fits.length}`);
  console.log(
    `  solver:    ${solver.medianMs.toFixed(2)} ms median (best ${solver.bestMs.toFixed(2)} ms), ${((solver.medianMs * 1e6) / fits.length).toFixed(0)} ns per pump`,
  );
  console.log(
    `  bisection: ${bisection.medianMs.toFixed(2)} ms median (best ${bisection.bestMs.toFixed(2)} ms), ${((bisection.medianMs * 1e6) / fits.length).toFixed(0)} ns per pump`,
  );
  console.log(`  bisection / solver time: ${(bisection.medianMs / solver.medianMs).toFixed(2)}x`);
  console.log(
    `  largest flow difference between the two, relative to the curve's range: ${largestDifference.toExponential(1)}`,
  );
  if (against !== undefined) {
    console.log(
      `  solver time against the single route with the same friction: ${(solver.medianMs / against).toFixed(1)}x`,
    );
  }
  return solver.medianMs;
}

const fits = syntheticStoredFits(PUMP_COUNT);
console.log(
  `Riffle solver benchmark: ${PUMP_COUNT} stored fits, ${WARM_UP_ROUNDS} warm-up and ${MEASURED_ROUNDS} measured rounds, single thread`,
);
console.log('Per pump: operating point, preferred-band class, input power and annual energy.');
const hazenWilliams = report(
  'System with Hazen-Williams friction (3 segments, 12 fittings)',
  compileSystemCurve({ ...POND_SYSTEM, frictionMethod: 'hazen-williams' }),
  fits,
);
const darcyWeisbach = report(
  'System with Darcy-Weisbach friction (precomputed Colebrook table)',
  compileSystemCurve({ ...POND_SYSTEM, frictionMethod: 'darcy-weisbach' }),
  fits,
);
report(
  'Two branches after a common run (falls and filter return), Hazen-Williams',
  compileBranchedSystem({ ...POND_WITH_TWO_BRANCHES, frictionMethod: 'hazen-williams' }),
  fits,
  hazenWilliams,
);
report(
  'Two branches after a common run (falls and filter return), Darcy-Weisbach',
  compileBranchedSystem({ ...POND_WITH_TWO_BRANCHES, frictionMethod: 'darcy-weisbach' }),
  fits,
  darcyWeisbach,
);
