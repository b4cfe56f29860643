import { FormControl } from '@angular/forms';
import { plausibleValidator } from './plausible-inputs';
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
});
