import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import {
  AbstractControl,
  FormBuilder,
  ReactiveFormsModule,
  type ValidationErrors,
  type ValidatorFn,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, map, of } from 'rxjs';
import type { PumpListQuery, PumpPage, PumpSortKey } from '../../../shared/api/api-schemas';
import { pumpKinds } from '../../../shared/vocabularies';
import { CatalogApi } from './catalog-api';
import { displayUnitChoices, kindLabels, showFlow, showHead } from '../shared/display-units';
import { DecimalInput } from '../shared/locale-numbers';

/** Min must not exceed max, for the pair of controls named. */
function orderedRange(minName: string, maxName: string): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const min = group.get(minName)?.value as number | null;
    const max = group.get(maxName)?.value as number | null;
    return min !== null && max !== null && min > max ? { [`${maxName}BelowMin`]: true } : null;
  };
}

/** Every pump of the catalog: filter by kind, supplier, flow and head, sort and page on the server. */
@Component({
  selector: 'rf-catalog-page',
  imports: [
    DecimalInput,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './catalog-page.html',
  styleUrl: './catalog-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CatalogPage {
  private readonly api = inject(CatalogApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly unitChoices = displayUnitChoices;
  protected readonly kinds = pumpKinds.map((value) => ({ value, label: kindLabels[value] }));
  protected readonly kindLabels = kindLabels;
  protected readonly showFlow = showFlow;
  protected readonly showHead = showHead;
  protected readonly rangeFields = [
    { name: 'flowMin', label: 'Flow from', quantity: 'flow' },
    { name: 'flowMax', label: 'Flow to', quantity: 'flow' },
    { name: 'headMin', label: 'Head from', quantity: 'head' },
    { name: 'headMax', label: 'Head to', quantity: 'head' },
  ] as const;
  protected readonly columns: readonly PumpSortKey[] = [
    'modelCode',
    'displayName',
    'kind',
    'supplier',
    'flowMax',
    'headMax',
    'bepEfficiency',
  ];
  protected readonly suppliers = toSignal(
    this.api.listSuppliers().pipe(
      map((list) => list.suppliers),
      catchError(() => of([])),
    ),
    { initialValue: [] },
  );

  protected readonly filters = inject(FormBuilder).group(
    {
      kind: [''],
      supplierId: [null as number | null],
      search: ['', Validators.maxLength(80)],
      flowMin: [null as number | null, Validators.min(0)],
      flowMax: [null as number | null, Validators.min(0)],
      headMin: [null as number | null, Validators.min(0)],
      headMax: [null as number | null, Validators.min(0)],
      units: [0],
    },
    { validators: [orderedRange('flowMin', 'flowMax'), orderedRange('headMin', 'headMax')] },
  );

  private readonly unitIndex = signal(0);
  protected readonly units = computed(() => displayUnitChoices[this.unitIndex()]);
  protected readonly sort = signal<Sort>({ active: 'modelCode', direction: 'asc' });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly result = signal<PumpPage | null>(null);
  protected readonly loading = signal(false);
  protected readonly failed = signal(false);

  constructor() {
    this.load();
  }

  protected applyFilters(): void {
    if (this.filters.invalid) {
      this.filters.markAllAsTouched();
      return;
    }
    this.unitIndex.set(this.filters.controls.units.value ?? 0);
    this.pageIndex.set(0);
    this.load();
  }

  protected clearFilters(): void {
    this.filters.reset({
      kind: '',
      supplierId: null,
      search: '',
      flowMin: null,
      flowMax: null,
      headMin: null,
      headMax: null,
      units: this.unitIndex(),
    });
    this.applyFilters();
  }

  protected sortChanged(sort: Sort): void {
    this.sort.set(sort.direction ? sort : { active: 'modelCode', direction: 'asc' });
    this.pageIndex.set(0);
    this.load();
  }

  protected pageChanged(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
    this.load();
  }

  private load(): void {
    const value = this.filters.getRawValue();
    const units = displayUnitChoices[this.unitIndex()];
    const query: PumpListQuery = {
      kind: pumpKinds.find((kind) => kind === value.kind),
      supplierId: value.supplierId ?? undefined,
      search: value.search?.trim() || undefined,
      flowMin: value.flowMin ?? undefined,
      flowMax: value.flowMax ?? undefined,
      headMin: value.headMin ?? undefined,
      headMax: value.headMax ?? undefined,
      flowUnit: units.flow,
      headUnit: units.head,
      sort: this.columns.find((column) => column === this.sort().active) ?? 'modelCode',
      order: this.sort().direction === 'desc' ? 'desc' : 'asc',
      page: this.pageIndex() + 1,
      pageSize: this.pageSize(),
    };
    this.loading.set(true);
    this.api
      .listPumps(query)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (page) => {
          this.result.set(page);
          this.failed.set(false);
          this.loading.set(false);
        },
        error: () => {
          this.failed.set(true);
          this.loading.set(false);
        },
      });
  }
}
