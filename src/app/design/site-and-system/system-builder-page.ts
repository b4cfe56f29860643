import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormArray,
  FormControl,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
  type AbstractControl,
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
import { designBranchStaticHead } from '../../../../shared/api/design-system';
import {
  BRANCH_COUNT_LIMITS,
  flowFromSI,
  flowToSI,
  headFromSI,
  lengthFromSI,
  VELOCITY_WARNING_LIMIT,
  type FrictionMethod,
} from '../../../../shared/hydraulics';
import {
  plausibleBranchLevelsValidator,
  plausibleLevelsValidator,
  plausibleValidator,
  suctionSideValidator,
} from '../plausible-inputs';
import { SelectionDraft } from '../selection-draft';
import { SystemSchematic } from '../system-schematic';
import {
  branchSharesOf,
  compileDraft,
  newBranch,
  staticHeadOf,
  toPipeSystem,
  type BranchShare,
  type SystemDraft,
} from '../system-draft';
import { branchForm, segmentForm, uniqueBranchNames, type BranchForm, type SegmentForm } from './segment-forms';
import { CableRunField } from './cable-run-field';
import { SegmentListEditor } from './segment-list-editor';
import { SystemCurvePreview, type BranchCurve, type CurvePoint } from './system-curve-preview';
import { DecimalInput, FigurePipe } from '../../shared/locale-numbers';

type RouteShape = 'single' | 'branches';

/** The form's value as the design's system: no branches on a single route, elevations only when typed. */
function draftOf(form: AbstractControl): SystemDraft {
  const { branches, siteElevation, pumpElevation, ...rest } = form.getRawValue() as SystemDraft & {
    siteElevation: number | null;
    pumpElevation: number | null;
  };
  return {
    ...rest,
    ...(branches?.length ? { branches } : {}),
    ...(siteElevation == null ? {} : { siteElevation }),
    ...(pumpElevation == null ? {} : { pumpElevation }),
  };
}

/** Points of the preview: enough for a smooth curve, cheap for the engine. */
const previewSteps = 40;

/** Step 1: the site's levels and the pipe route (one route, or a common run and branches), with a live system curve from the shared engine. */
@Component({
  selector: 'rf-system-builder-page',
  imports: [
    NgTemplateOutlet,
    FigurePipe,
    DecimalInput,
    CableRunField,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    SegmentListEditor,
    SystemCurvePreview,
    SystemSchematic,
  ],
  templateUrl: './system-builder-page.html',
  styleUrls: ['../design-page.scss', './system-builder-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SystemBuilderPage {
  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly draft = inject(SelectionDraft);
  protected readonly units = this.draft.units;
  protected readonly branchLimits = BRANCH_COUNT_LIMITS;
  protected readonly frictionMethods: ReadonlyArray<{ id: FrictionMethod; label: string }> = [
    { id: 'hazen-williams', label: 'Hazen-Williams (water, 4-25 C)' },
    { id: 'darcy-weisbach', label: 'Darcy-Weisbach with Colebrook' },
  ];

  protected readonly form = this.buildForm(this.draft.system());
  protected readonly routeShape = new FormControl<RouteShape>(
    this.form.controls.branches.length ? 'branches' : 'single',
    { nonNullable: true },
  );

  private readonly value = toSignal(
    this.form.valueChanges.pipe(
      startWith(null),
      map(() => draftOf(this.form)),
    ),
    { initialValue: draftOf(this.form) },
  );
  private readonly status = toSignal(this.form.statusChanges.pipe(startWith(this.form.status)), {
    initialValue: this.form.status,
  });

  protected readonly staticHead = computed(() => staticHeadOf(this.value()));
  protected readonly branched = computed(() => (this.value().branches?.length ?? 0) > 0);
  protected readonly hasSuction = computed(() => this.value().segments.some((segment) => segment.side === 'suction'));
  /** Each branch's static head as the calculations get it (typed, or from its outlet level). */
  protected readonly branchHeads = computed(() =>
    (this.value().branches ?? []).map((branch) => designBranchStaticHead(branch, this.value())),
  );
  /** The system as the schematic draws it: the last valid one. */
  protected readonly shown = computed(() => (this.status() === 'VALID' ? this.value() : this.draft.system()));

  /** The preview, or the engine's reason why it cannot be drawn. */
  protected readonly preview = computed(
    ():
      | {
          points: CurvePoint[];
          atBand: { min: number; max: number };
          velocity: number;
          shares: BranchShare[][];
          branchCurves: BranchCurve[];
        }
      | { problem: string } => {
      if (this.status() !== 'VALID') return { problem: 'Complete the fields marked in red to see the system curve.' };
      const units = this.units();
      const band = this.draft.band();
      try {
        const system = toPipeSystem(this.value());
        const curve = compileDraft(system, units);
        const top = flowToSI(band.flowMax * 1.6, units.flow);
        const points = Array.from({ length: previewSteps + 1 }, (_, step) => {
          const flow = (top * step) / previewSteps;
          return { flow: flowFromSI(flow, units.flow), head: headFromSI(curve.evaluate(flow), units.head) };
        });
        const headAt = (flow: number) => headFromSI(curve.evaluate(flowToSI(flow, units.flow)), units.head);
        const shares = branchSharesOf(system, units, [band.flowMin, band.flowMax]);
        const sharesAlong = branchSharesOf(
          system,
          units,
          points.map((point) => point.flow),
        );
        const branchCurves = (sharesAlong[0] ?? []).map((branch, index) => ({
          name: branch.name,
          points: sharesAlong.map((row, step) => ({ flow: row[index].flow, head: points[step].head })),
        }));
        const smallestArea = Math.min(...curve.segments.map((segment) => segment.area));
        const commonVelocity = curve.segments.length
          ? lengthFromSI(flowToSI(band.flowMax, units.flow) / smallestArea, units.length)
          : 0;
        return {
          points,
          atBand: { min: headAt(band.flowMin), max: headAt(band.flowMax) },
          velocity: Math.max(commonVelocity, ...(shares[1] ?? []).map((share) => share.velocity)),
          shares,
          branchCurves,
        };
      } catch (error) {
        return { problem: error instanceof Error ? error.message : String(error) };
      }
    },
  );

  protected readonly velocityLimit = computed(() => lengthFromSI(VELOCITY_WARNING_LIMIT, this.units().length));

  constructor() {
    // A value counts only where it is in use: a stale one hidden behind the levels or the branches must not block the form.
    const { staticMode, staticHead, dischargeLevel, outletPressureHead, branches } = this.form.controls;
    const useStaticMode = () => {
      const mode = staticMode.value;
      const single = branches.length === 0;
      const set = (control: AbstractControl, on: boolean) =>
        on ? control.enable({ emitEvent: false }) : control.disable({ emitEvent: false });
      set(staticHead, single && mode === 'direct');
      set(dischargeLevel, single);
      set(outletPressureHead, single);
      for (const branch of branches.controls) {
        branch.controls.staticMode.setValue(mode, { emitEvent: false });
        set(branch.controls.staticHead, mode === 'direct');
        set(branch.controls.outletLevel, mode === 'levels');
      }
      this.form.updateValueAndValidity();
    };
    useStaticMode();
    staticMode.valueChanges.subscribe(useStaticMode);
    this.routeShape.valueChanges.subscribe((shape) => {
      const current = draftOf(this.form);
      branches.clear({ emitEvent: false });
      if (shape === 'branches') {
        for (const name of ['Falls', 'Filter return'])
          branches.push(this.branch(newBranch(current, name)), { emitEvent: false });
      } else if (this.segments.length === 0) {
        this.segments.push(this.segment(exampleSegment(current)), { emitEvent: false });
      }
      this.segments.setValidators(shape === 'branches' ? [] : [Validators.minLength(1)]);
      this.segments.updateValueAndValidity({ emitEvent: false });
      useStaticMode();
    });
    this.form.valueChanges.subscribe(() => {
      if (this.form.valid) this.draft.setSystem(draftOf(this.form));
    });
  }

  protected get segments(): FormArray<SegmentForm> {
    return this.form.controls.segments;
  }

  protected get branches(): FormArray<BranchForm> {
    return this.form.controls.branches;
  }

  protected addBranch(): void {
    this.branches.push(this.branch(newBranch(draftOf(this.form), `Branch ${this.branches.length + 1}`)));
    this.form.controls.staticMode.setValue(this.form.controls.staticMode.value);
  }

  protected removeBranch(index: number): void {
    this.branches.removeAt(index);
  }

  private segment(segment: SystemDraft['segments'][number]): SegmentForm {
    return segmentForm(this.formBuilder, segment, this.units);
  }

  private branch(branch: NonNullable<SystemDraft['branches']>[number]): BranchForm {
    return branchForm(this.formBuilder, branch, this.units);
  }

  private buildForm(system: SystemDraft) {
    const number = (value: number, ...validators: ValidatorFn[]) =>
      this.formBuilder.control(value, [Validators.required, ...validators]);
    const branched = (system.branches?.length ?? 0) > 0;
    return this.formBuilder.group(
      {
        staticMode: this.formBuilder.control<'direct' | 'levels'>(system.staticMode),
        staticHead: number(system.staticHead, plausibleValidator('staticHead', this.units)),
        intakeLevel: number(system.intakeLevel),
        dischargeLevel: number(system.dischargeLevel),
        outletPressureHead: number(system.outletPressureHead, plausibleValidator('outletPressureHead', this.units)),
        waterTemperatureC: number(system.waterTemperatureC, Validators.min(0), Validators.max(40)),
        frictionMethod: this.formBuilder.control<FrictionMethod>(system.frictionMethod),
        siteElevation: this.formBuilder.control<number | null>(system.siteElevation ?? null),
        pumpElevation: this.formBuilder.control<number | null>(system.pumpElevation ?? null),
        segments: this.formBuilder.array(
          system.segments.map((segment) => this.segment(segment)),
          branched ? [] : [Validators.minLength(1)],
        ),
        branches: this.formBuilder.array(
          (system.branches ?? []).map((branch) => this.branch(branch)),
          [uniqueBranchNames],
        ),
      },
      {
        validators: [
          plausibleLevelsValidator(this.units),
          plausibleBranchLevelsValidator(this.units),
          suctionSideValidator(this.units, draftOf),
        ],
      },
    );
  }
}

/** A first segment for a route left with none: the common run's last size, 10 lengths long. */
function exampleSegment(draft: SystemDraft): SystemDraft['segments'][number] {
  const last = draft.branches?.[0]?.segments[0];
  return {
    series: last?.series ?? 'pvc-sch40',
    size: last?.size ?? 'pvc-sch40-3',
    length: 10,
    fittings: [],
    extraK: 0,
  };
}
