import {
  FormArray,
  FormControl,
  FormGroup,
  Validators,
  type NonNullableFormBuilder,
  type ValidatorFn,
} from '@angular/forms';
import type { CalculationUnits } from '../../../../shared/api/api-schemas';
import { visibleTextProblem } from '../../../../shared/text-rules';
import { aboveZero, plausibleValidator } from '../plausible-inputs';
import type { BranchDraft, SegmentDraft } from '../system-draft';

/*
 * The form groups of the site page's pipe: a segment (fittings, equipment, its side), and a
 * branch (name, outlet, its own segments), built the same way for the route, the common run and
 * every branch.
 */

export type FittingForm = FormGroup<{ kind: FormControl<string>; count: FormControl<number> }>;
export type EquipmentForm = FormGroup<{
  name: FormControl<string>;
  headLoss: FormControl<number>;
  atFlow: FormControl<number>;
}>;
export type SegmentForm = FormGroup<{
  series: FormControl<string>;
  size: FormControl<string>;
  length: FormControl<number>;
  extraK: FormControl<number>;
  /** Custom bore, C and roughness: empty (null) keeps the size's. */
  insideDiameter: FormControl<number | null>;
  hazenWilliamsC: FormControl<number | null>;
  roughness: FormControl<number | null>;
  side: FormControl<'suction' | 'discharge'>;
  fittings: FormArray<FittingForm>;
  equipment: FormArray<EquipmentForm>;
}>;
export type BranchForm = FormGroup<{
  name: FormControl<string>;
  staticMode: FormControl<'direct' | 'levels'>;
  staticHead: FormControl<number>;
  outletLevel: FormControl<number>;
  outletPressureHead: FormControl<number>;
  segments: FormArray<SegmentForm>;
}>;

type Units = () => CalculationUnits;

export function fittingForm(builder: NonNullableFormBuilder, fitting: { kind: string; count: number }): FittingForm {
  return builder.group({
    kind: builder.control(fitting.kind),
    count: builder.control(fitting.count, [
      Validators.required,
      Validators.min(0),
      Validators.max(1000),
      Validators.pattern(/^\d+$/),
    ]),
  });
}

export function equipmentForm(
  builder: NonNullableFormBuilder,
  entry: { name: string; headLoss: number; atFlow: number },
): EquipmentForm {
  return builder.group({
    name: builder.control(entry.name, [Validators.required, Validators.maxLength(80)]),
    headLoss: builder.control(entry.headLoss, [Validators.required, Validators.min(0)]),
    atFlow: builder.control(entry.atFlow, [Validators.required, aboveZero]),
  });
}

export function segmentForm(builder: NonNullableFormBuilder, segment: SegmentDraft, units: Units): SegmentForm {
  return builder.group({
    series: builder.control(segment.series),
    size: builder.control(segment.size),
    length: builder.control(segment.length, [
      Validators.required,
      aboveZero,
      plausibleValidator('segmentLength', units),
    ]),
    extraK: builder.control(segment.extraK, [
      Validators.required,
      Validators.min(0),
      plausibleValidator('extraK', units),
    ]),
    insideDiameter: builder.control<number | null>(segment.insideDiameter ?? null, [
      aboveZero,
      plausibleValidator('insideDiameter', units),
    ]),
    hazenWilliamsC: builder.control<number | null>(segment.hazenWilliamsC ?? null, [
      Validators.min(1),
      Validators.max(200),
    ]),
    roughness: builder.control<number | null>(segment.roughness ?? null, [
      Validators.min(0),
      plausibleValidator('roughness', units),
    ]),
    side: builder.control<'suction' | 'discharge'>(segment.side ?? 'discharge'),
    fittings: builder.array(segment.fittings.map((fitting) => fittingForm(builder, fitting))),
    equipment: builder.array((segment.equipment ?? []).map((entry) => equipmentForm(builder, entry))),
  });
}

/** The names of the branches must differ (the calculations refuse a repeated one); on the branches' array. */
export const uniqueBranchNames: ValidatorFn = (control) => {
  const names = (control.value as Array<{ name?: string }>).map((branch) => (branch.name ?? '').trim().toLowerCase());
  return names.some((name, index) => name !== '' && names.indexOf(name) !== index) ? { repeatedName: true } : null;
};

export function branchForm(builder: NonNullableFormBuilder, branch: BranchDraft, units: Units): BranchForm {
  const number = (value: number, ...validators: ValidatorFn[]) =>
    builder.control(value, [Validators.required, ...validators]);
  return builder.group({
    name: builder.control(branch.name, [
      Validators.required,
      Validators.maxLength(60),
      (control) => {
        const problem = visibleTextProblem(String(control.value ?? ''));
        return problem ? { text: problem } : null;
      },
    ]),
    staticMode: builder.control<'direct' | 'levels'>(branch.staticMode),
    staticHead: number(branch.staticHead, plausibleValidator('staticHead', units)),
    outletLevel: number(branch.outletLevel),
    outletPressureHead: number(
      branch.outletPressureHead,
      Validators.min(0),
      plausibleValidator('outletPressureHead', units),
    ),
    segments: builder.array(
      branch.segments.map((segment) => segmentForm(builder, segment, units)),
      Validators.minLength(1),
    ),
  });
}
