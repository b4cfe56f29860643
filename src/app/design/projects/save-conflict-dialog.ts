import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

/** What the designer does when the project was saved elsewhere since this tab opened it. */
export type SaveConflictChoice = 'reload' | 'save-as-new';

/** Tells that the save was refused as stale and offers to reload the saved project or keep this design as a new one. */
@Component({
  selector: 'rf-save-conflict-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Saved elsewhere since you opened it</h2>
    <mat-dialog-content>
      <p role="alert">
        "{{ name }}" was saved in another tab or by someone else after you opened it, so your save was not made. Reload
        the saved project (your changes here are dropped), or keep your design as a new project.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-stroked-button type="button" [mat-dialog-close]="'reload'">Reload the saved project</button>
      <button mat-flat-button type="button" [mat-dialog-close]="'save-as-new'">Save mine as new</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveConflictDialog {
  protected readonly name = inject<string>(MAT_DIALOG_DATA);
}
