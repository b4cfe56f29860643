import { requireFinite, requireInRange, requireNonNegative } from './hydraulics-error';

/*
 * Life-cycle cost of a pump set, in the currency of its prices. The Hydraulic Institute and
 * Europump, "Pump Life Cycle Costs: A Guide to LCC Analysis for Pumping Systems" (2001), set
 * LCC = Cic + Cin + Ce + Co + Cm + Cs + Cenv + Cd with every yearly cost brought to its present
 * value over the life. The catalog holds only list prices, so Cic is the list price of the set
 * and Ce the energy; installation, operation, maintenance, downtime, environment and disposal
 * are not known here and count as zero.
 */

/**
 * Present value of a growing annuity: a first payment A one year from now, rising by g a year,
 * for n years, discounted at i: PV = A (1 - ((1 + g) / (1 + i))^n) / (i - g), and n A / (1 + i)
 * when g = i (the limit). Source: the growing-annuity formula of corporate finance (Brealey,
 * Myers and Allen, "Principles of Corporate Finance", the chapter on present values).
 * @param firstPayment - the first year's amount, paid at the end of year 1 (>= 0)
 * @param discountRate - i, a fraction a year (0-1)
 * @param growthRate - g, a fraction a year (0-1)
 * @param years - n, whole years (1-100)
 * @returns the present value, in the payment's currency
 * @example
 * // by hand: 1000 a year for 10 years at 5 %, no rise: 1000 (1 - 1.05^-10) / 0.05
 * presentValueOfGrowingAnnuity(1000, 0.05, 0, 10) // => 7721.73
 * // by hand: rise equal to the rate, 10 x 1000 / 1.05
 * presentValueOfGrowingAnnuity(1000, 0.05, 0.05, 10) // => 9523.81
 * // no discounting and no rise: the plain sum
 * presentValueOfGrowingAnnuity(1000, 0, 0, 10) // => 10000
 */
export function presentValueOfGrowingAnnuity(
  firstPayment: number,
  discountRate: number,
  growthRate: number,
  years: number,
): number {
  requireNonNegative(firstPayment, '/firstPayment', 'first payment');
  requireInRange(discountRate, 0, 1, '/discountRate', 'discount rate');
  requireInRange(growthRate, 0, 1, '/growthRate', 'growth rate');
  requireInRange(years, 1, 100, '/years', 'years');
  const ratio = (1 + growthRate) / (1 + discountRate);
  if (Math.abs(discountRate - growthRate) < 1e-12) return (years * firstPayment) / (1 + discountRate);
  return (firstPayment * (1 - ratio ** years)) / (discountRate - growthRate);
}

export interface LifeCycleCostInputs {
  /** Cic: the set's first cost (list prices), currency. */
  initialCost: number;
  /** Ce in the first year, currency. */
  annualEnergyCost: number;
  years: number;
  /** Fraction a year. */
  discountRate: number;
  /** Fraction a year. */
  energyPriceRise: number;
}

/**
 * LCC = Cic + PV(Ce) (HI / Europump, 2001, with the costs Riffle cannot know at zero; see the
 * note at the top), the energy's present value by presentValueOfGrowingAnnuity.
 * @param inputs - first cost, first year's energy cost, years, discount rate and energy price rise
 * @returns the life-cycle cost, in the prices' currency
 * @example
 * // by hand: 1200 + 438 (1 - (1.03 / 1.06)^15) / 0.03 = 1200 + 438 x 11.6638
 * lifeCycleCost({ initialCost: 1200, annualEnergyCost: 438, years: 15, discountRate: 0.06, energyPriceRise: 0.03 }) // => 6308.75
 */
export function lifeCycleCost(inputs: LifeCycleCostInputs): number {
  requireFinite(inputs.initialCost, '/initialCost', 'initial cost');
  requireNonNegative(inputs.initialCost, '/initialCost', 'initial cost');
  return (
    inputs.initialCost +
    presentValueOfGrowingAnnuity(inputs.annualEnergyCost, inputs.discountRate, inputs.energyPriceRise, inputs.years)
  );
}
