import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { CalculationUnits } from '../../../../shared/api/api-schemas';
import { diameterFromSI, FITTINGS, PIPE_SERIES } from '../../../../shared/hydraulics';
import { equipmentForm, fittingForm, segmentForm, type SegmentForm } from './segment-forms';
import { DecimalInput } from '../../shared/locale-numbers';

/** The segments of one run of pipe (the route, the common run or a branch): size, length, fittings, equipment, side. */
@Component({
  selector: 'rf-segment-list-editor',
  imports: [
    DecimalInput,
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
  ],
  templateUrl: './segment-list-editor.html',
  styleUrls: ['./system-builder-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SegmentListEditor {
  private readonly formBuilder = inject(NonNullableFormBuilder);
  readonly segments = input.required<FormArray<SegmentForm>>();
  readonly units = input.required<CalculationUnits>();
  /** Put before every control's name, so two lists on a page keep distinct names. */
  readonly prefix = input('');
  /** The fewest segments the list keeps (the common run before branches may have none). */
  readonly minimum = input(1);
  /** Whether a segment may be marked as the suction side (the route or the common run only). */
  readonly suction = input(false);
  /** The flow a new piece of equipment is rated at. */
  readonly ratedFlow = input(100);
  readonly label = input('Segment');
  readonly addLabel = input('Pipe segment');

  protected readonly series = PIPE_SERIES;
  /** Reducers and expansions need a diameter ratio this form does not ask for: the API takes them. */
  protected readonly fittingKinds = FITTINGS.filter((fitting) => fitting.resistance.method !== 'diameter-ratio');

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

  protected setSide(segment: SegmentForm, suction: boolean): void {
    segment.controls.side.setValue(suction ? 'suction' : 'discharge');
  }

  protected addSegment(): void {
    const segments = this.segments();
    const last = segments.at(segments.length - 1)?.getRawValue();
    segments.push(
      segmentForm(
        this.formBuilder,
        {
          series: last?.series ?? 'pvc-sch40',
          size: last?.size ?? 'pvc-sch40-2',
          length: 10,
          extraK: 0,
          fittings: [],
          equipment: [],
        },
        this.units,
      ),
    );
  }

  protected addFitting(segment: SegmentForm): void {
    segment.controls.fittings.push(fittingForm(this.formBuilder, { kind: 'elbow-90-standard', count: 1 }));
  }

  protected removeFitting(segment: SegmentForm, index: number): void {
    segment.controls.fittings.removeAt(index);
  }

  protected addEquipment(segment: SegmentForm): void {
    segment.controls.equipment.push(
      equipmentForm(this.formBuilder, { name: 'Filter', headLoss: 1, atFlow: this.ratedFlow() }),
    );
  }

  protected removeEquipment(segment: SegmentForm, index: number): void {
    segment.controls.equipment.removeAt(index);
  }
}
