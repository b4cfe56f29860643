import { HttpErrorResponse, HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { catchError, map, of, type Subscription } from 'rxjs';
import type { CurveImportIssue, CurveImportRecord, CurveImportReport } from '../../../shared/api/api-schemas';
import { CatalogApi } from '../catalog/catalog-api';
import { displayUnitChoices, kindLabels, showFlow, showHead } from '../shared/display-units';
import { PumpCurveChart } from '../shared/pump-curve-chart';
import { attachmentFileName, saveFile } from '../shared/file-download';
import { SessionService } from '../core/session-service';
import { CurveImportApi } from './curve-import-api';

const outcomeLabels: Record<string, string> = {
  new: 'New pump',
  changed: 'Changed',
  unchanged: 'Unchanged',
  refused: 'Refused',
};

/** For supplier admins: check a curve-table file, preview every pump with its fit, commit it, see past imports, download the current table. */
@Component({
  selector: 'rf-curve-import-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, MatSelectModule, MatTableModule, PumpCurveChart],
  templateUrl: './curve-import-page.html',
  styleUrl: './curve-import-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CurveImportPage {
  private readonly api = inject(CurveImportApi);
  private readonly session = inject(SessionService);

  protected readonly unitChoices = displayUnitChoices;
  protected readonly unitIndex = signal(0);
  protected readonly units = computed(() => displayUnitChoices[this.unitIndex()]);
  protected readonly kindLabels = kindLabels;
  protected readonly outcomeLabels = outcomeLabels;
  protected readonly showFlow = showFlow;
  protected readonly showHead = showHead;
  protected readonly pumpColumns = ['curve', 'pump', 'outcome', 'fit', 'bep', 'warnings'];
  protected readonly historyColumns = ['importedAt', 'importedBy', 'fileName', 'counts'];
  protected readonly formatExample = [
    'riffle-curve-table,1',
    'flow-unit,m3/h',
    'head-unit,m',
    'efficiency-unit,%',
    'model_code,display_name,kind,preferred_flow_min,preferred_flow_max,flow,head,efficiency',
    'FS-40,Stream pump 40,submersible,3,5,0,7.5,0',
    'FS-40,,,,,2,7.1,38',
    'FS-40,,,,,4,6.0,52',
    'FS-40,,,,,6,4.1,49',
  ].join('\n');

  protected readonly isAdmin = computed(() => this.session.role() === 'admin');
  protected readonly suppliers = toSignal(
    inject(CatalogApi)
      .listSuppliers()
      .pipe(
        map((list) => list.suppliers),
        catchError(() => of([])),
      ),
    { initialValue: [] },
  );
  private readonly chosenSupplierId = signal<number | null>(null);
  /** A supplier admin's own supplier; an admin picks one. */
  protected readonly supplierId = computed(
    () => this.session.user()?.supplierId ?? this.chosenSupplierId() ?? this.suppliers()[0]?.id ?? null,
  );
  protected readonly supplierName = computed(
    () => this.suppliers().find((supplier) => supplier.id === this.supplierId())?.name ?? '',
  );

  protected readonly file = signal<File | null>(null);
  protected readonly report = signal<CurveImportReport | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  /** While busy: the share of the file sent (0-1), then null while the server checks it. */
  protected readonly sent = signal<number | null>(0);
  /** Whether the running send is a commit, which the server finishes once the file has arrived. */
  protected readonly committing = signal(false);
  private running: Subscription | null = null;
  protected readonly history = signal<CurveImportRecord[]>([]);

  protected readonly errors = computed<CurveImportIssue[]>(() => this.report()?.errors ?? []);
  protected readonly warningCount = computed(() => {
    const report = this.report();
    return report ? report.warnings.length + report.pumps.reduce((sum, pump) => sum + pump.warnings.length, 0) : 0;
  });
  protected readonly canCommit = computed(() => {
    const report = this.report();
    return (
      !!report &&
      report.dryRun &&
      report.errors.length === 0 &&
      report.counts.new + report.counts.changed > 0 &&
      !this.busy()
    );
  });

  constructor() {
    effect(() => {
      const supplierId = this.supplierId();
      if (supplierId !== null) this.loadHistory(supplierId);
    });
  }

  protected chooseSupplier(supplierId: number): void {
    this.chosenSupplierId.set(supplierId);
    this.report.set(null);
  }

  protected fileChosen(event: Event): void {
    const input = event.target as HTMLInputElement;
    this.file.set(input.files?.[0] ?? null);
    this.report.set(null);
    this.problem.set(null);
    if (this.file()) this.send(true);
  }

  protected commit(): void {
    this.send(false);
  }

  /** The supplier's current curves as a curve table, to keep, edit and load again. */
  protected downloadCurrent(): void {
    const supplierId = this.supplierId();
    if (supplierId === null) return;
    this.api.exportCurveTable(supplierId).subscribe((response) => {
      if (response.body)
        saveFile(response.body, attachmentFileName(response.headers.get('Content-Disposition'), 'curve-table.csv'));
    });
  }

  protected describe(issue: CurveImportIssue): string {
    const where = [issue.row !== null ? `Row ${issue.row}` : null, issue.column ? `column ${issue.column}` : null]
      .filter(Boolean)
      .join(', ');
    return `${where || 'File'}: ${issue.message}${issue.expected ? ` (expected ${issue.expected})` : ''}`;
  }

  private send(dryRun: boolean): void {
    const file = this.file();
    const supplierId = this.supplierId();
    if (!file || supplierId === null) return;
    this.busy.set(true);
    this.sent.set(0);
    this.committing.set(!dryRun);
    this.problem.set(null);
    this.running = this.api.importCurveTable(supplierId, file, dryRun).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          const fraction = event.total ? event.loaded / event.total : 0;
          this.sent.set(fraction >= 1 ? null : fraction);
        } else if (event.type === HttpEventType.Response && event.body) {
          this.report.set(event.body);
          this.finished();
          if (!dryRun) this.loadHistory(supplierId);
        }
      },
      error: (error: HttpErrorResponse) => {
        this.finished();
        const refused = (error.error as { report?: CurveImportReport } | null)?.report;
        if (refused) this.report.set(refused);
        else this.problem.set((error.error as { detail?: string } | null)?.detail ?? 'The file could not be sent.');
      },
    });
  }

  /** Stops the send: the upload is aborted, and nothing is saved unless a commit's file had already arrived. */
  protected cancel(): void {
    const arrived = this.sent() === null;
    this.running?.unsubscribe();
    this.finished();
    this.problem.set(
      this.committing() && arrived
        ? 'Stopped waiting: the whole file had arrived, so the server finishes the save. Check the history below.'
        : 'Cancelled: nothing was saved.',
    );
  }

  private finished(): void {
    this.running = null;
    this.busy.set(false);
  }

  private loadHistory(supplierId: number): void {
    this.api.listCurveImports(supplierId).subscribe({
      next: (list) => this.history.set(list.imports),
      error: () => this.history.set([]),
    });
  }
}
