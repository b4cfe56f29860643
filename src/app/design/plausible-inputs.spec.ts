import { FormControl, FormGroup } from '@angular/forms';
import { PLAUSIBLE_LIMIT_CASES } from '../../../test/support/plausible-limit-cases';
import { aboveZero, plausibleLevelsValidator, plausibleValidator } from './plausible-inputs';
import { unitSystems } from './unit-systems';

describe('plausibleValidator', () => {
  it('checks a value in the units of the moment, and says the limit in them', () => {
    let units = unitSystems.us.units;
    const control = new FormControl(600, { validators: plausibleValidator('staticHead', () => units) });
    // 600 ft is 183 m: inside the 500 m limit
    expect(control.valid).toBe(true);
    units = unitSystems.si.units;
    control.updateValueAndValidity();
    expect(control.getError('plausible')).toBe('static head must be at most 500 m');
    control.setValue(-499);
    expect(control.valid).toBe(true);
    control.setValue(-501);
    expect(control.getError('plausible')).toBe('static head must be at least -500 m');
  });

  // the same cases the API's test posts (test/server/calculations/plausible-limits-api.test.ts)
  for (const { limit, system, units, side, outside, inside } of PLAUSIBLE_LIMIT_CASES) {
    it(`${limit} ${side} in ${system} units: refuses just outside, accepts just inside`, () => {
      const control = new FormControl(outside, { validators: plausibleValidator(limit, () => units) });
      expect(control.getError('plausible')).toMatch(side === 'max' ? / must be at most / : / must be at least /);
      control.setValue(inside);
      expect(control.valid).toBe(true);
    });
  }
});

describe('aboveZero', () => {
  it('refuses zero and less, as the contract does, and lets the smallest positive number through', () => {
    const control = new FormControl(0, { validators: aboveZero });
    expect(control.hasError('aboveZero')).toBe(true);
    control.setValue(-1);
    expect(control.hasError('aboveZero')).toBe(true);
    control.setValue(0.001);
    expect(control.valid).toBe(true);
  });
});

describe('plausibleLevelsValidator', () => {
  function levels(staticMode: 'direct' | 'levels', intakeLevel: number, dischargeLevel: number) {
    return new FormGroup(
      {
        staticMode: new FormControl(staticMode),
        intakeLevel: new FormControl(intakeLevel),
        dischargeLevel: new FormControl(dischargeLevel),
      },
      { validators: plausibleLevelsValidator(() => unitSystems.si.units) },
    );
  }

  it('holds the head between two levels to the static head limit', () => {
    expect(levels('levels', 10, 509).valid).toBe(true);
    expect(levels('levels', 10, 511).getError('plausibleLevels')).toBe('static head must be at most 500 m');
    expect(levels('levels', 511, 10).getError('plausibleLevels')).toBe('static head must be at least -500 m');
  });

  it('leaves the levels alone when the static head is typed directly', () => {
    expect(levels('direct', 0, 2000).valid).toBe(true);
  });
});
