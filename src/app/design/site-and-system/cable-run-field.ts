import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { DecimalInput } from '../../shared/locale-numbers';
import { aboveZero } from '../plausible-inputs';
import { SelectionDraft } from '../selection-draft';

/** The longest run the contract takes, in the design's length unit. */
const longestRun = 100_000;

/**
 * The site step's cable run: how far the pump stands from its supply, one way. The report step
 * suggests a conductor for each pump from it; it changes no search.
 */
@Component({
  selector: 'rf-cable-run-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, DecimalInput],
  template: `
    <section class="rf-card" aria-labelledby="rf-cable-title">
      <h2 id="rf-cable-title">Power to the pump</h2>
      <div class="rf-row">
        <mat-form-field class="rf-wide">
          <mat-label>Cable run to the pump, one way</mat-label>
          <input matInput type="number" [formControl]="length" name="cableLength" />
          <span matTextSuffix>{{ draft.units().length }}</span>
          <mat-hint>From the panel or outlet to the pump; optional. The report suggests a conductor for it.</mat-hint>
          <mat-error>Enter a length above 0, or leave it empty.</mat-error>
        </mat-form-field>
      </div>
    </section>
  `,
  styleUrls: ['../design-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CableRunField {
  protected readonly draft = inject(SelectionDraft);
  protected readonly length = new FormControl<number | null>(this.draft.cableLength(), [
    aboveZero,
    Validators.max(longestRun),
  ]);

  constructor() {
    this.length.valueChanges.pipe(takeUntilDestroyed()).subscribe((value) => {
      this.draft.setCableLength(this.length.valid && typeof value === 'number' ? value : null);
    });
  }
}
