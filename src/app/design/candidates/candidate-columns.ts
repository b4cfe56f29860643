import { Injectable, computed, inject, linkedSignal } from '@angular/core';
import { SessionService } from '../../core/session-service';

/** The candidates table's columns that the designer may hide, in table order, with their menu names. */
export const choosableColumns = [
  { id: 'arrangement', name: 'Pumps' },
  { id: 'flow', name: 'Flow' },
  { id: 'head', name: 'TDH' },
  { id: 'bep', name: '% of BEP' },
  { id: 'region', name: 'Region' },
  { id: 'power', name: 'Input power' },
  { id: 'energy', name: 'kWh / year' },
  { id: 'cost', name: 'Cost / year' },
  { id: 'price', name: 'List price' },
  { id: 'firstCost', name: 'First cost' },
  { id: 'lifeCycleCost', name: 'Life-cycle cost' },
  { id: 'oneFailed', name: 'One failed' },
  { id: 'misses', name: 'Misses' },
  { id: 'warnings', name: 'Warnings' },
  { id: 'reasons', name: 'Why this place' },
] as const;

export type ChoosableColumn = (typeof choosableColumns)[number]['id'];

/** Always shown, and kept in view while the table scrolls sideways: the pick, the place and the pump. */
export const stickyColumns = ['compare', 'rank', 'pump'] as const;

const everyChoosable: readonly ChoosableColumn[] = choosableColumns.map((column) => column.id);

/**
 * Which columns of the candidates table a designer shows, kept per signed-in user in this browser
 * (local storage under the user's id), so the choice survives sign-out and a new search.
 */
@Injectable({ providedIn: 'root' })
export class CandidateColumns {
  private readonly session = inject(SessionService);
  private readonly storageKey = computed(() => `riffle.candidate-columns.${this.session.user()?.id ?? 'anonymous'}`);
  // read again when another user signs in on this browser
  private readonly chosen = linkedSignal(() => restore(this.storageKey()));

  /** The shown columns the designer chose, in table order. */
  readonly shown = this.chosen.asReadonly();
  /** Every column of the table as it renders now. */
  readonly displayed = computed(() => [...stickyColumns, ...this.chosen()]);

  show(columns: readonly string[]): void {
    const wanted = everyChoosable.filter((column) => columns.includes(column));
    this.chosen.set(wanted);
    try {
      localStorage.setItem(this.storageKey(), JSON.stringify(wanted));
    } catch {
      // storage full or blocked: the choice holds for this page only
    }
  }
}

function restore(storageKey: string): readonly ChoosableColumn[] {
  try {
    const stored: unknown = JSON.parse(localStorage.getItem(storageKey) ?? 'null');
    if (Array.isArray(stored)) return everyChoosable.filter((column) => stored.includes(column));
  } catch {
    // unreadable: fall back to every column
  }
  return everyChoosable;
}
