import {
  annualEnergy,
  annualEnergyUnchecked,
  energyCost,
  parallelHeadCurve,
  polynomialValue,
  preferredFlowRegion,
  solveOperatingPoint,
  STANDARD_GRAVITY,
  VELOCITY_WARNING_LIMIT,
  type CompiledSystemCurve,
  type HeadCurve,
  type PreferredBand,
} from '../../shared/hydraulics';
import {
  dutyOfParallelPumps,
  type DutyOutcome,
  type DutyPoint,
  type DutyWarning,
} from '../calculations/arrangement-duty';
import type { CatalogPump, CatalogState } from '../catalog/catalog-snapshot';

/*
 * The duty-point search over the catalog snapshot, in SI. For each pump and each number of
 * identical pumps in parallel, the operating point lies in the duty band [Qmin, Qmax] exactly
 * when d(Q) = h(Q/m) - H_sys(Q), which falls with Q (pump head non-increasing, system rising),
 * is >= 0 at the band's low end and <= 0 at its high end, both clipped to the combined curve's
 * published range. That sign test costs two polynomial evaluations; the pairs that pass it (and a
 * few near misses when too few pass) are solved and ranked on numbers alone (the one-failed check
 * is the same sign test at Qmin with one pump fewer), and only the few that make the answer are
 * worked out in full, with their reasons.
 */

export type SelectionWarningCode = DutyWarning | 'velocity';

export interface SelectionQuery {
  system: CompiledSystemCurve;
  density: number;
  /** m3/s */
  flowMin: number;
  flowMax: number;
  arrangements: readonly number[];
  requireOneFailed: boolean;
  /** One more pump installed idle per arrangement, taking over when a running one fails. */
  standby: boolean;
  band: PreferredBand;
  hoursPerDay: number;
  tariffPerKWh: number | null;
  motorEfficiency: number;
  /** W per pump, or null for no limit. */
  maxInputPowerPerPump: number | null;
  onlyPreferredRegion: boolean;
  accepts: (pump: CatalogPump) => boolean;
  limit: number;
}

export interface RankedCandidate {
  pump: CatalogPump;
  running: number;
  point: DutyPoint;
  oneFailed: DutyPoint | null;
  inBand: boolean;
  oneFailedMeetsMinimum: boolean | null;
  annualKWh: number | null;
  annualCost: number | null;
  warnings: SelectionWarningCode[];
  /** 0 best: in band, preferred and one-failed as required; 1 in band with a shortfall; 2 outside the band. */
  tier: number;
  reasons: string[];
  /** The combined curve's preferred region, total flow, m3/s. */
  preferredRange: { flowMin: number; flowMax: number } | null;
}

export interface SelectionOutcome {
  considered: number;
  inBand: number;
  candidates: RankedCandidate[];
}

/**
 * What the hot loops read of every pump, in flat arrays built once per catalog state: head,
 * efficiency and power coefficients padded to a cubic (4 per pump), ranges, BEP flow and the
 * supplier's declared preferred range (NaN when absent).
 */
interface PackedCurves {
  coefficients: Float64Array;
  flowMin: Float64Array;
  flowMax: Float64Array;
  efficiency: Float64Array;
  power: Float64Array;
  /** 0 none, 1 efficiency only, 2 fitted power (shaft), 3 fitted power (electrical). */
  powerSource: Uint8Array;
  electricalEfficiency: Uint8Array;
  bepFlow: Float64Array;
  declaredMin: Float64Array;
  declaredMax: Float64Array;
}

function padded(target: Float64Array, index: number, values: readonly number[] | null): void {
  values?.forEach((value, power) => {
    target[index * 4 + power] = value;
  });
}

function packedCurves(state: CatalogState): PackedCurves {
  const memo = state.derived.get('packed-curves') as PackedCurves | undefined;
  if (memo) return memo;
  const count = state.pumps.length;
  const packed: PackedCurves = {
    coefficients: new Float64Array(count * 4),
    flowMin: new Float64Array(count),
    flowMax: new Float64Array(count),
    efficiency: new Float64Array(count * 4),
    power: new Float64Array(count * 4),
    powerSource: new Uint8Array(count),
    electricalEfficiency: new Uint8Array(count),
    bepFlow: new Float64Array(count).fill(Number.NaN),
    declaredMin: new Float64Array(count).fill(Number.NaN),
    declaredMax: new Float64Array(count).fill(Number.NaN),
  };
  state.pumps.forEach(({ fit, declaredPreferred }, index) => {
    padded(packed.coefficients, index, fit.headCoefficients);
    padded(packed.efficiency, index, fit.efficiencyCoefficients);
    padded(packed.power, index, fit.powerCoefficients);
    packed.flowMin[index] = fit.flowMin;
    packed.flowMax[index] = fit.flowMax;
    packed.powerSource[index] = fit.powerCoefficients
      ? fit.powerBasis === 'electrical'
        ? 3
        : 2
      : fit.efficiencyCoefficients
        ? 1
        : 0;
    packed.electricalEfficiency[index] = fit.powerBasis === 'electrical' ? 1 : 0;
    if (fit.bep) packed.bepFlow[index] = fit.bep.flow;
    if (declaredPreferred) {
      packed.declaredMin[index] = declaredPreferred.flowMin;
      packed.declaredMax[index] = declaredPreferred.flowMax;
    }
  });
  state.derived.set('packed-curves', packed);
  return packed;
}

/** Nodes of the system-curve table over the duty band. */
const BAND_TABLE_INTERVALS = 64;

/**
 * The system curve over the duty band as a cubic Hermite table built from the engine's exact
 * head and slope at 65 nodes: every sign test and every solve of a pair in band reads the
 * system there, and a table costs a few multiplications where Hazen-Williams costs a power and
 * Darcy-Weisbach a friction-factor lookup per segment. Interpolation error of a cubic Hermite
 * is bounded by h^4 max|H''''| / 384 (de Boor, A Practical Guide to Splines, 2001, ch. IV),
 * far below 1e-9 of the head for these smooth curves; outside the band the engine is used.
 */
class BandSystemTable {
  private readonly heads = new Float64Array(BAND_TABLE_INTERVALS + 1);
  private readonly slopes = new Float64Array(BAND_TABLE_INTERVALS + 1);
  private readonly step: number;

  constructor(
    private readonly system: CompiledSystemCurve,
    private readonly low: number,
    private readonly high: number,
  ) {
    this.step = (high - low) / BAND_TABLE_INTERVALS;
    const out = new Float64Array(2);
    for (let node = 0; node <= BAND_TABLE_INTERVALS; node += 1) {
      system.headAndSlope(low + node * this.step, out);
      this.heads[node] = out[0];
      this.slopes[node] = out[1] * this.step;
    }
  }

  /** System head at `flow`, m, and, when `out` is given, dH/dQ into out[0]. */
  head(flow: number, out?: Float64Array): number {
    if (!(flow >= this.low && flow <= this.high) || this.step === 0) {
      if (out) out[0] = this.system.slope(flow);
      return this.system.evaluate(flow);
    }
    const position = (flow - this.low) / this.step;
    const node = Math.min(Math.floor(position), BAND_TABLE_INTERVALS - 1);
    const t = position - node;
    const t2 = t * t;
    const t3 = t2 * t;
    const h0 = this.heads[node];
    const h1 = this.heads[node + 1];
    const m0 = this.slopes[node];
    const m1 = this.slopes[node + 1];
    if (out)
      out[0] =
        ((6 * t2 - 6 * t) * h0 + (3 * t2 - 4 * t + 1) * m0 + (-6 * t2 + 6 * t) * h1 + (3 * t2 - 2 * t) * m1) /
        this.step;
    return (2 * t3 - 3 * t2 + 1) * h0 + (t3 - 2 * t2 + t) * m0 + (-2 * t3 + 3 * t2) * h1 + (t3 - t2) * m1;
  }
}

/**
 * The crossing of h(Q/m) and the system inside a bracket with h above the system at `low` and
 * below it at `high`: regula falsi to start, then Newton steps kept inside the shrinking bracket
 * and bisection when one would leave it (Press et al., Numerical Recipes, 3rd ed., 2007, section
 * 9.4, "rtsafe"), to 1e-8 of the bracket: enough to rank by, the ranked few are then solved by
 * the engine itself.
 */
function crossingInBracket(
  coefficients: Float64Array,
  offset: number,
  running: number,
  table: BandSystemTable,
  low: number,
  high: number,
): number {
  const surplusLow = cubicAt(coefficients, offset, low / running) - table.head(low);
  const surplusHigh = cubicAt(coefficients, offset, high / running) - table.head(high);
  if (surplusLow <= 0) return low;
  if (surplusHigh >= 0) return high;
  const c1 = coefficients[offset + 1];
  const c2 = coefficients[offset + 2];
  const c3 = coefficients[offset + 3];
  const tolerance = 1e-8 * high;
  let flow = low + ((high - low) * surplusLow) / (surplusLow - surplusHigh);
  for (let iteration = 0; iteration < 50; iteration += 1) {
    const x = flow / running;
    const surplus = cubicAt(coefficients, offset, x) - table.head(flow, systemSlope);
    if (surplus > 0) low = flow;
    else high = flow;
    const derivative = (c1 + x * (2 * c2 + 3 * c3 * x)) / running - systemSlope[0];
    let next = derivative < 0 ? flow - surplus / derivative : Number.NaN;
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - flow) <= tolerance) return next;
    flow = next;
  }
  return flow;
}

/** Scratch for the system slope in crossingInBracket (single-threaded, never held across calls). */
const systemSlope = new Float64Array(1);

function cubicAt(coefficients: Float64Array, offset: number, flow: number): number {
  return (
    coefficients[offset] +
    flow * (coefficients[offset + 1] + flow * (coefficients[offset + 2] + flow * coefficients[offset + 3]))
  );
}

/** Velocity warning for the whole system at a total flow: the smallest bore carries the highest velocity. */
function velocityExceeded(system: CompiledSystemCurve, flow: number): boolean {
  return system.segments.some((segment) => flow / segment.area > VELOCITY_WARNING_LIMIT);
}

function percent(value: number | null): string {
  return value === null ? '' : ` (${Math.round(value)} % of BEP)`;
}

/** 0: in band, preferred and redundant as required; 1: in band with a shortfall; 2: outside the band. */
function tierOf(inBand: boolean, preferred: boolean, redundancyMet: boolean): number {
  if (!inBand) return 2;
  return preferred && redundancyMet ? 0 : 1;
}

function rankCandidate(
  pump: CatalogPump,
  running: number,
  point: DutyPoint,
  query: SelectionQuery,
): RankedCandidate | null {
  if (query.onlyPreferredRegion && point.region !== 'preferred') return null;
  if (
    query.maxInputPowerPerPump !== null &&
    point.inputPower !== null &&
    point.inputPower / running > query.maxInputPowerPerPump
  )
    return null;
  const inBand = point.flow >= query.flowMin * (1 - 1e-9) && point.flow <= query.flowMax * (1 + 1e-9);
  const reasons: string[] = [];
  if (inBand) reasons.push('in the duty band');
  else reasons.push(point.flow < query.flowMin ? 'below the duty band' : 'above the duty band');
  if (point.region === 'preferred') reasons.push(`in the preferred operating region${percent(point.percentOfBep)}`);
  else if (point.region === 'allowable')
    reasons.push(`outside POR, inside the maker's allowable region${percent(point.percentOfBep)}`);
  else if (point.region === 'outside') reasons.push(`outside POR${percent(point.percentOfBep)}`);
  else reasons.push('no efficiency data: the BEP and the preferred region are unknown');

  let oneFailed: DutyPoint | null = null;
  let oneFailedMeetsMinimum: boolean | null = null;
  if (query.standby) {
    // the standby starts in the failed pump's place: the arrangement runs on at the same point
    oneFailed = point;
    oneFailedMeetsMinimum = point.flow >= query.flowMin * (1 - 1e-9);
    reasons.push(
      oneFailedMeetsMinimum
        ? 'one failed: the standby takes over at the same point'
        : 'below the band minimum even with the standby',
    );
  } else if (running >= 2) {
    const failed: DutyOutcome = dutyOfParallelPumps(
      pump,
      query.system,
      running - 1,
      query.band,
      query.density,
      query.motorEfficiency,
    );
    if (failed.ok) {
      oneFailed = failed.point;
      oneFailedMeetsMinimum = failed.point.flow >= query.flowMin * (1 - 1e-9);
      reasons.push(
        oneFailedMeetsMinimum ? 'one failed: still at or above the band minimum' : 'below band with one failed',
      );
      if (failed.point.warnings.includes('run-out')) reasons.push('run-out with one failed');
    } else {
      oneFailedMeetsMinimum = false;
      reasons.push(
        failed.reason === 'beyond-curve'
          ? 'run-out with one failed: the rest run past their curve'
          : 'with one failed the rest deliver nothing',
      );
    }
  } else if (query.requireOneFailed) {
    reasons.push('a single pump: no flow at all when it fails');
  }
  const warnings: SelectionWarningCode[] = [...point.warnings];
  if (velocityExceeded(query.system, point.flow)) warnings.push('velocity');
  if (point.warnings.includes('run-out')) reasons.push('run-out');
  if (point.warnings.includes('dead-head')) reasons.push('near dead-head');

  const tier = tierOf(inBand, point.region === 'preferred', !query.requireOneFailed || oneFailedMeetsMinimum === true);
  const annualKWh = point.inputPower === null ? null : annualEnergy(point.inputPower, query.hoursPerDay);
  const perPump = preferredFlowRegion(pump.fit, query.band, pump.declaredPreferred);
  return {
    pump,
    running,
    point,
    oneFailed,
    inBand,
    oneFailedMeetsMinimum,
    annualKWh,
    annualCost: annualKWh === null || query.tariffPerKWh === null ? null : energyCost(annualKWh, query.tariffPerKWh),
    warnings,
    tier,
    reasons,
    preferredRange: perPump ? { flowMin: perPump.flowMin * running, flowMax: perPump.flowMax * running } : null,
  };
}

/** Ranks the catalog's pumps for one system and duty band (see the note at the top). */
export function searchCatalog(state: CatalogState, query: SelectionQuery): SelectionOutcome {
  const packed = packedCurves(state);
  const { coefficients, flowMin, flowMax } = packed;
  const { system, arrangements } = query;
  const table = new BandSystemTable(system, query.flowMin, query.flowMax);
  const systemAtMin = table.head(query.flowMin);
  const systemAtMax = table.head(query.flowMax);
  const accepted = new Uint8Array(state.pumps.length);
  const inBand = inBandBuffer(4 * state.pumps.length * arrangements.length);
  let inBandCount = 0;
  let considered = 0;

  for (let index = 0; index < state.pumps.length; index += 1) {
    if (!query.accepts(state.pumps[index])) continue;
    accepted[index] = 1;
    const offset = index * 4;
    for (let arrangement = 0; arrangement < arrangements.length; arrangement += 1) {
      const running = arrangements[arrangement];
      considered += 1;
      const low = Math.max(query.flowMin, running * flowMin[index]);
      const high = Math.min(query.flowMax, running * flowMax[index]);
      if (low > high) continue;
      if (cubicAt(coefficients, offset, low / running) < (low === query.flowMin ? systemAtMin : table.head(low)))
        continue;
      if (cubicAt(coefficients, offset, high / running) > (high === query.flowMax ? systemAtMax : table.head(high)))
        continue;
      const at = 4 * inBandCount;
      inBand[at] = index;
      inBand[at + 1] = running;
      inBand[at + 2] = low;
      inBand[at + 3] = high;
      inBandCount += 1;
    }
  }

  // Tiers first, by sign tests alone; pairs of a tier are solved only while the better tiers
  // leave room in the answer, since a tier's every key ranks below the tier above it.
  const tiers = tierBuffer(inBandCount);
  for (let pair = 0; pair < inBandCount; pair += 1) {
    const at = 4 * pair;
    tiers[pair] = tierInBand(packed, inBand[at], inBand[at + 1], inBand[at + 2], inBand[at + 3], query, table);
  }
  const ranking = new TopPairs(query.limit);
  for (let tier = 0; tier <= 1 && ranking.size < query.limit; tier += 1) {
    for (let pair = 0; pair < inBandCount; pair += 1) {
      if (tiers[pair] !== tier) continue;
      const at = 4 * pair;
      const index = inBand[at];
      const running = inBand[at + 1];
      const flow = crossingInBracket(coefficients, index * 4, running, table, inBand[at + 2], inBand[at + 3]);
      const head = cubicAt(coefficients, index * 4, flow / running);
      ranking.offer(index, running, screenPoint(packed, index, running, flow, head, query, table));
    }
  }
  if (ranking.size < query.limit) nearMisses(state, query, accepted, 2 * (query.limit - ranking.size), ranking, table);
  const candidates = ranking
    .best()
    .map(([index, running]) => {
      const pump = state.pumps[index];
      const duty = dutyOfParallelPumps(pump, system, running, query.band, query.density, query.motorEfficiency);
      return duty.ok ? rankCandidate(pump, running, duty.point, query) : null;
    })
    .filter((candidate): candidate is RankedCandidate => candidate !== null);
  return { considered, inBand: inBandCount, candidates };
}

let sharedInBand = new Float64Array(0);
let sharedTiers = new Uint8Array(0);

function tierBuffer(length: number): Uint8Array {
  if (sharedTiers.length < length) sharedTiers = new Uint8Array(length);
  return sharedTiers;
}

/**
 * The tier of a pair known to run in band, without solving: preferred when the crossing lies
 * inside the preferred region too (the same sign test on the region's flows clipped to the
 * bracket), redundant by the one-failed sign test.
 */
function tierInBand(
  packed: PackedCurves,
  index: number,
  running: number,
  low: number,
  high: number,
  query: SelectionQuery,
  table: BandSystemTable,
): number {
  if (!redundancyMetBySignTest(packed, index, running, query, table)) return 1;
  const declaredMin = packed.declaredMin[index];
  const bepFlow = packed.bepFlow[index];
  const perPump = preferredFlowRegion(
    {
      bep: bepFlow === bepFlow ? { flow: bepFlow } : null,
      flowMin: packed.flowMin[index],
      flowMax: packed.flowMax[index],
    },
    query.band,
    declaredMin === declaredMin ? { flowMin: declaredMin, flowMax: packed.declaredMax[index] } : null,
  );
  if (!perPump) return 1;
  const preferredLow = Math.max(low, running * perPump.flowMin);
  const preferredHigh = Math.min(high, running * perPump.flowMax);
  if (!(preferredLow <= preferredHigh)) return 1;
  const offset = index * 4;
  const crossesAfterLow = cubicAt(packed.coefficients, offset, preferredLow / running) >= table.head(preferredLow);
  const crossesBeforeHigh = cubicAt(packed.coefficients, offset, preferredHigh / running) <= table.head(preferredHigh);
  return crossesAfterLow && crossesBeforeHigh ? 0 : 1;
}

/**
 * Pairs in band, four numbers each (pump index, number running, bracket of the crossing), in one
 * buffer reused by every search: a search runs to its end without yielding, and a fresh buffer
 * per request would be a megabyte of garbage at 10,000 pumps.
 */
function inBandBuffer(length: number): Float64Array {
  if (sharedInBand.length < length) sharedInBand = new Float64Array(length);
  return sharedInBand;
}

/** Every pump's combined head curve for `running` identical pumps, built once per catalog state. */
function combinedCurves(state: CatalogState, running: number): readonly HeadCurve[] {
  const key = `combined-curves-${running}`;
  let curves = state.derived.get(key) as HeadCurve[] | undefined;
  if (!curves) {
    curves = state.pumps.map((pump) => parallelHeadCurve(pump.fit, running));
    state.derived.set(key, curves);
  }
  return curves;
}

/**
 * The `limit` best pairs by rank key (tier, then annual energy), kept sorted while offers stream
 * in, so the thousands of pairs in a wide band are never sorted as a whole. Ties go to the pair
 * offered first (lower pump index).
 */
class TopPairs {
  private readonly keys: number[] = [];
  private readonly pairs: Array<[number, number]> = [];

  constructor(private readonly limit: number) {}

  get size(): number {
    return this.keys.length;
  }

  /** `key` is null for a pair the filters leave out. */
  offer(index: number, running: number, key: number | null): void {
    if (key === null) return;
    if (this.keys.length === this.limit && key >= this.keys[this.keys.length - 1]) return;
    let at = this.keys.length;
    while (at > 0 && this.keys[at - 1] > key) at -= 1;
    this.keys.splice(at, 0, key);
    this.pairs.splice(at, 0, [index, running]);
    if (this.keys.length > this.limit) {
      this.keys.pop();
      this.pairs.pop();
    }
  }

  best(): Array<[number, number]> {
    return this.pairs;
  }
}

/**
 * When too few pairs run in band: the `count` out-of-band pairs whose head at the band's middle
 * comes closest to the system's, solved on their whole published range.
 */
function nearMisses(
  state: CatalogState,
  query: SelectionQuery,
  accepted: Uint8Array,
  count: number,
  ranking: TopPairs,
  table: BandSystemTable,
): void {
  const packed = packedCurves(state);
  const { coefficients, flowMin, flowMax } = packed;
  const middle = (query.flowMin + query.flowMax) / 2;
  const systemAtMiddle = query.system.evaluate(middle);
  const gaps: Array<{ index: number; running: number; gap: number }> = [];
  for (let index = 0; index < state.pumps.length; index += 1) {
    if (!accepted[index]) continue;
    for (const running of query.arrangements) {
      const perPump = Math.min(Math.max(middle / running, flowMin[index]), flowMax[index]);
      gaps.push({ index, running, gap: Math.abs(cubicAt(coefficients, index * 4, perPump) - systemAtMiddle) });
    }
  }
  gaps.sort((a, b) => a.gap - b.gap);
  for (const { index, running } of gaps.slice(0, count)) {
    const solved = solveOperatingPoint(combinedCurves(state, running)[index], query.system);
    if (!solved.ok) continue;
    const key = screenPoint(packed, index, running, solved.flow, solved.head, query, table);
    if (key !== null && key >= 2 * TIER_SPAN) ranking.offer(index, running, key);
  }
}

/** Rank keys are tier x TIER_SPAN + annual kWh: no water-feature pump uses 1e12 kWh a year. */
const TIER_SPAN = 1e12;

/** Redundancy as asked: none needed, a standby that takes over, or the rest reaching the band's minimum with one off. */
function redundancyMetBySignTest(
  packed: PackedCurves,
  index: number,
  running: number,
  query: SelectionQuery,
  table: BandSystemTable,
): boolean {
  return (
    !query.requireOneFailed ||
    query.standby ||
    (running >= 2 && oneFailedReachesMinimum(packed, index, running, query, table))
  );
}

/** With one pump off, do the rest still reach the band's minimum? The sign test at Qmin with running - 1 pumps. */
function oneFailedReachesMinimum(
  packed: PackedCurves,
  index: number,
  running: number,
  query: SelectionQuery,
  table: BandSystemTable,
): boolean {
  const remaining = running - 1;
  const low = Math.max(query.flowMin, remaining * packed.flowMin[index]);
  if (low > remaining * packed.flowMax[index]) return false;
  return cubicAt(packed.coefficients, index * 4, low / remaining) >= table.head(low);
}

/**
 * The rank key of a solved pair (tier x TIER_SPAN + annual kWh; unknown energy ranks last in its
 * tier), or null when a filter leaves it out. Read from the packed arrays without the engine's
 * checks, as this runs for every pair in band, but with the same region rule as
 * dutyOfParallelPumps and the same power rule as powerAtOperatingPoint (fitted power, else water
 * power over fitted efficiency; motor efficiency applied unless the curve's power is electrical).
 */
function screenPoint(
  packed: PackedCurves,
  index: number,
  running: number,
  flow: number,
  head: number,
  query: SelectionQuery,
  table: BandSystemTable,
): number | null {
  const flowPerPump = Math.min(Math.max(flow / running, packed.flowMin[index]), packed.flowMax[index]);
  const declaredMin = packed.declaredMin[index];
  const percentOfBep = (100 * flowPerPump) / packed.bepFlow[index];
  const preferred =
    declaredMin === declaredMin
      ? flowPerPump >= declaredMin && flowPerPump <= packed.declaredMax[index]
      : percentOfBep >= query.band.minPercent && percentOfBep <= query.band.maxPercent;
  if (query.onlyPreferredRegion && !preferred) return null;
  const source = packed.powerSource[index];
  const losses = packed.electricalEfficiency[index] === 1 ? 1 : query.motorEfficiency;
  let power = Number.NaN;
  if (source >= 2) power = cubicAt(packed.power, index * 4, flowPerPump) / losses;
  else if (source === 1) {
    const efficiency = cubicAt(packed.efficiency, index * 4, flowPerPump);
    if (efficiency > 0) power = (query.density * STANDARD_GRAVITY * flowPerPump * head) / (efficiency * losses);
  }
  if (query.maxInputPowerPerPump !== null && power > query.maxInputPowerPerPump) return null;
  const inBand = flow >= query.flowMin * (1 - 1e-9) && flow <= query.flowMax * (1 + 1e-9);
  const redundancyMet = redundancyMetBySignTest(packed, index, running, query, table);
  const energy =
    power === power
      ? Math.min(annualEnergyUnchecked(power * running, query.hoursPerDay), TIER_SPAN - 1)
      : TIER_SPAN - 1;
  return tierOf(inBand, preferred, redundancyMet) * TIER_SPAN + energy;
}

/** The combined curve of `running` pumps sampled at `count` flows over its published range, SI. */
export function sampledCombinedCurve(
  pump: CatalogPump,
  running: number,
  count = 17,
): Array<{ flow: number; head: number }> {
  const { fit } = pump;
  return Array.from({ length: count }, (_, step) => {
    const perPump = fit.flowMin + ((fit.flowMax - fit.flowMin) * step) / (count - 1);
    return { flow: perPump * running, head: polynomialValue(fit.headCoefficients, perPump) };
  });
}
