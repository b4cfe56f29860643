import { expect } from 'chai';
import { HydraulicsInputError, lifeCycleCost, presentValueOfGrowingAnnuity } from '../../shared/hydraulics';

/** The present value summed year by year, the closed form's definition: sum of A (1+g)^(t-1) / (1+i)^t. */
function summedYearByYear(first: number, rate: number, growth: number, years: number): number {
  let total = 0;
  for (let year = 1; year <= years; year += 1) total += (first * (1 + growth) ** (year - 1)) / (1 + rate) ** year;
  return total;
}

describe('life-cycle cost', () => {
  it('the growing annuity agrees with the year-by-year sum it stands for', () => {
    for (const [rate, growth, years] of [
      [0.05, 0, 10],
      [0.08, 0.03, 20],
      [0.03, 0.06, 15],
      [0.05, 0.05, 12],
    ]) {
      const expected = summedYearByYear(500, rate, growth, years);
      expect(presentValueOfGrowingAnnuity(500, rate, growth, years)).to.be.closeTo(expected, 1e-9 * expected);
    }
  });

  it('a level annuity matches the annuity factor of a printed table: 10 years at 5 % is 7.7217', () => {
    // the present value of 1 a year for 10 years at 5 %, (1 - 1.05^-10) / 0.05, by hand
    expect(presentValueOfGrowingAnnuity(1, 0.05, 0, 10)).to.be.closeTo(7.7217, 5e-5);
  });

  it('adds the first cost to the energy present value, and a higher discount rate lowers it', () => {
    const inputs = { initialCost: 1200, annualEnergyCost: 438, years: 15, discountRate: 0.06, energyPriceRise: 0.03 };
    // by hand: 438 (1 - (1.03/1.06)^15) / 0.03 = 5108.75
    expect(lifeCycleCost(inputs)).to.be.closeTo(1200 + 5108.75, 0.01);
    expect(lifeCycleCost({ ...inputs, discountRate: 0.1 })).to.be.lessThan(lifeCycleCost(inputs));
  });

  it('refuses zero years and a negative rate, naming the field', () => {
    expect(() => presentValueOfGrowingAnnuity(100, 0.05, 0, 0))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/years');
    expect(() => presentValueOfGrowingAnnuity(100, -0.01, 0, 5))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/discountRate');
  });
});
