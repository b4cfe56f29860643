import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormArray,
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
  type ValidatorFn,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { map, startWith } from 'rxjs';
import {
  diameterFromSI,
  FITTINGS,
  flowFromSI,
  flowToSI,
  headFromSI,
  lengthFromSI,
  PIPE_SERIES,
  VELOCITY_WARNING_LIMIT,
  type FrictionMethod,
} from '../../../../shared/hydraulics';
import { aboveZero, plausibleLevelsValidator, plausibleValidator } from '../plausible-inputs';
import { SelectionDraft } from '../selection-draft';
import { compileDraft, staticHeadOf, toPipeSystem, type SegmentDraft, type SystemDraft } from '../system-draft';
import { CableRunField } from './cable-run-field';
import { SystemCurvePreview, type CurvePoint } from './system-curve-preview';
import { DecimalInput, FigurePipe } from '../../shared/locale-numbers';

type FittingForm = FormGroup<{ kind: FormControl<string>; count: FormControl<number> }>;
type EquipmentForm = FormGroup<{
  name: FormControl<string>;
  headLoss: FormControl<number>;
  atFlow: FormControl<number>;
}>;
type SegmentForm = FormGroup<{
  series: FormControl<string>;
  size: FormControl<string>;
  length: FormControl<number>;
  extraK: FormControl<number>;
  /** Custom bore, C and roughness: empty (null) keeps the size's. */
  insideDiameter: FormControl<number | null>;
  hazenWilliamsC: FormControl<number | null>;
  roughness: FormControl<number | null>;
  fittings: FormArray<FittingForm>;
  equipment: FormArray<EquipmentForm>;
}>;

/** Points of the preview: enough for a smooth curve, cheap for the engine. */
const previewSteps = 40;

/** Step 1: the site's levels and the pipe route, with a live system curve from the shared engine. */
@Component({
  selector: 'rf-system-builder-page',
  imports: [
    FigurePipe,
    DecimalInput,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    SystemCurvePreview,
    CableRunField,
  ],
  templateUrl: './system-builder-page.html',
  styleUrls: ['../design-page.scss', './system-builder-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SystemBuilderPage {
  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly draft = inject(SelectionDraft);
  protected readonly units = this.draft.units;
  protected readonly series = PIPE_SERIES;
  /** Reducers and expansions need a diameter ratio this form does not ask for: the API takes them. */
  protected readonly fittingKinds = FITTINGS.filter((fitting) => fitting.resistance.method !== 'diameter-ratio');
  protected readonly frictionMethods: ReadonlyArray<{ id: FrictionMethod; label: string }> = [
    { id: 'hazen-williams', label: 'Hazen-Williams (water, 4-25 C)' },
    { id: 'darcy-weisbach', label: 'Darcy-Weisbach with Colebrook' },
  ];

  protected readonly form = this.buildForm(this.draft.system());

  private readonly value = toSignal(
    this.form.valueChanges.pipe(
      startWith(null),
      map(() => this.form.getRawValue() as SystemDraft),
    ),
    {
      initialValue: this.form.getRawValue() as SystemDraft,
    },
  );
  private readonly status = toSignal(this.form.statusChanges.pipe(startWith(this.form.status)), {
    initialValue: this.form.status,
  });

  protected readonly staticHead = computed(() => staticHeadOf(this.value()));

  /** The preview, or the engine's reason why it cannot be drawn. */
  protected readonly preview = computed(
    (): { points: CurvePoint[]; atBand: { min: number; max: number }; velocity: number } | { problem: string } => {
      if (this.status() !== 'VALID') return { problem: 'Complete the fields marked in red to see the system curve.' };
      const units = this.units();
      const band = this.draft.band();
      try {
        const curve = compileDraft(toPipeSystem(this.value()), units);
        const top = flowToSI(band.flowMax * 1.6, units.flow);
        const points = Array.from({ length: previewSteps + 1 }, (_, step) => {
          const flow = (top * step) / previewSteps;
          return { flow: flowFromSI(flow, units.flow), head: headFromSI(curve.evaluate(flow), units.head) };
        });
        const headAt = (flow: number) => headFromSI(curve.evaluate(flowToSI(flow, units.flow)), units.head);
        const smallestArea = Math.min(...curve.segments.map((segment) => segment.area));
        return {
          points,
          atBand: { min: headAt(band.flowMin), max: headAt(band.flowMax) },
          velocity: lengthFromSI(flowToSI(band.flowMax, units.flow) / smallestArea, units.length),
        };
      } catch (error) {
        return { problem: error instanceof Error ? error.message : String(error) };
      }
    },
  );

  protected readonly velocityLimit = computed(() => lengthFromSI(VELOCITY_WARNING_LIMIT, this.units().length));

  constructor() {
    // The typed static head counts only when it is the one in use: a stale value hidden behind the levels must not block the form.
    const { staticMode, staticHead } = this.form.controls;
    const useStaticMode = (mode: 'direct' | 'levels') =>
      mode === 'levels' ? staticHead.disable({ emitEvent: false }) : staticHead.enable({ emitEvent: false });
    useStaticMode(staticMode.value);
    staticMode.valueChanges.subscribe(useStaticMode);
    this.form.valueChanges.subscribe(() => {
      if (this.form.valid) this.draft.setSystem(this.form.getRawValue() as SystemDraft);
    });
  }

  protected get segments(): FormArray<SegmentForm> {
    return this.form.controls.segments;
  }

  protected sizesOf(seriesId: string) {
    return PIPE_SERIES.find((series) => series.id === seriesId)?.sizes ?? [];
  }

  protected insideDiameterLabel(size: { insideDiameter: number }): string {
    const unit = this.units().diameter;
    const value = diameterFromSI(size.insideDiameter, unit);
    return `${value.toFixed(unit === 'in' ? 3 : 1)} ${unit} bore`;
  }

  /** A new series keeps the nominal size when the series has it. */
  protected seriesChanged(segment: SegmentForm): void {
    const sizes = this.sizesOf(segment.controls.series.value);
    const nominal = segment.controls.size.value.split('-').at(-1);
    segment.controls.size.setValue((sizes.find((size) => String(size.nominalSize) === nominal) ?? sizes[0]).id);
  }

  protected addSegment(): void {
    const last = this.segments.at(this.segments.length - 1)?.getRawValue();
    this.segments.push(
      this.segmentForm({
        series: last?.series ?? 'pvc-sch40',
        size: last?.size ?? 'pvc-sch40-2',
        length: 10,
        extraK: 0,
        fittings: [],
        equipment: [],
      }),
    );
  }

  protected removeSegment(index: number): void {
    this.segments.removeAt(index);
  }

  protected addFitting(segment: SegmentForm): void {
    segment.controls.fittings.push(this.fittingForm({ kind: 'elbow-90-standard', count: 1 }));
  }

  protected removeFitting(segment: SegmentForm, index: number): void {
    segment.controls.fittings.removeAt(index);
  }

  protected addEquipment(segment: SegmentForm): void {
    segment.controls.equipment.push(
      this.equipmentForm({ name: 'Filter', headLoss: 1, atFlow: this.draft.band().flowMax }),
    );
  }

  protected removeEquipment(segment: SegmentForm, index: number): void {
    segment.controls.equipment.removeAt(index);
  }

  private buildForm(system: SystemDraft) {
    const number = (value: number, ...validators: ValidatorFn[]) =>
      this.formBuilder.control(value, [Validators.required, ...validators]);
    return this.formBuilder.group(
      {
        staticMode: this.formBuilder.control<'direct' | 'levels'>(system.staticMode),
        staticHead: number(system.staticHead, plausibleValidator('staticHead', this.units)),
        intakeLevel: number(system.intakeLevel),
        dischargeLevel: number(system.dischargeLevel),
        outletPressureHead: number(system.outletPressureHead, plausibleValidator('outletPressureHead', this.units)),
        waterTemperatureC: number(system.waterTemperatureC, Validators.min(0), Validators.max(40)),
        frictionMethod: this.formBuilder.control<FrictionMethod>(system.frictionMethod),
        segments: this.formBuilder.array(
          system.segments.map((segment) => this.segmentForm(segment)),
          Validators.minLength(1),
        ),
      },
      { validators: plausibleLevelsValidator(this.units) },
    );
  }

  private segmentForm(segment: SegmentDraft): SegmentForm {
    return this.formBuilder.group({
      series: this.formBuilder.control(segment.series),
      size: this.formBuilder.control(segment.size),
      length: this.formBuilder.control(segment.length, [
        Validators.required,
        aboveZero,
        plausibleValidator('segmentLength', this.units),
      ]),
      extraK: this.formBuilder.control(segment.extraK, [
        Validators.required,
        Validators.min(0),
        plausibleValidator('extraK', this.units),
      ]),
      insideDiameter: this.formBuilder.control<number | null>(segment.insideDiameter ?? null, [
        aboveZero,
        plausibleValidator('insideDiameter', this.units),
      ]),
      hazenWilliamsC: this.formBuilder.control<number | null>(segment.hazenWilliamsC ?? null, [
        Validators.min(1),
        Validators.max(200),
      ]),
      roughness: this.formBuilder.control<number | null>(segment.roughness ?? null, [
        Validators.min(0),
        plausibleValidator('roughness', this.units),
      ]),
      fittings: this.formBuilder.array(segment.fittings.map((fitting) => this.fittingForm(fitting))),
      equipment: this.formBuilder.array((segment.equipment ?? []).map((entry) => this.equipmentForm(entry))),
    });
  }

  private equipmentForm(entry: { name: string; headLoss: number; atFlow: number }): EquipmentForm {
    return this.formBuilder.group({
      name: this.formBuilder.control(entry.name, [Validators.required, Validators.maxLength(80)]),
      headLoss: this.formBuilder.control(entry.headLoss, [Validators.required, Validators.min(0)]),
      atFlow: this.formBuilder.control(entry.atFlow, [Validators.required, aboveZero]),
    });
  }

  private fittingForm(fitting: { kind: string; count: number }): FittingForm {
    return this.formBuilder.group({
      kind: this.formBuilder.control(fitting.kind),
      count: this.formBuilder.control(fitting.count, [
        Validators.required,
        Validators.min(0),
        Validators.max(1000),
        Validators.pattern(/^\d+$/),
      ]),
    });
  }
}
