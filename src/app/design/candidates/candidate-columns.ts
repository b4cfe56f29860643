import { Injectable, computed, effect, inject, linkedSignal, untracked } from '@angular/core';
import type { CandidateColumn } from '../../../../shared/vocabularies';
import { SessionService } from '../../core/session-service';
import { UserPreferences } from '../../core/user-preferences';

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
] as const satisfies readonly { id: CandidateColumn; name: string }[];

export type ChoosableColumn = (typeof choosableColumns)[number]['id'];

/** Always shown, and kept in view while the table scrolls sideways: the pick, the place and the pump. */
export const stickyColumns = ['compare', 'rank', 'pump'] as const;

const everyChoosable: readonly ChoosableColumn[] = choosableColumns.map((column) => column.id);

/**
 * Which columns of the candidates table a designer shows. The server keeps the choice per user, so
 * it follows them to any browser; this browser keeps a copy under the user's id (local storage),
 * shown first while the server is asked and kept when the server cannot be reached.
 */
@Injectable({ providedIn: 'root' })
export class CandidateColumns {
  private readonly session = inject(SessionService);
  private readonly preferences = inject(UserPreferences);
  private readonly storageKey = computed(() => `riffle.candidate-columns.${this.session.user()?.id ?? 'anonymous'}`);
  // this browser's copy until the server answers with a choice; read again when another user signs in
  private readonly chosen = linkedSignal(() => {
    const kept = this.preferences.candidateColumns();
    return kept ? inTableOrder(kept) : (storedChoice(this.storageKey()) ?? everyChoosable);
  });

  /** The shown columns the designer chose, in table order. */
  readonly shown = this.chosen.asReadonly();
  /** Every column of the table as it renders now. */
  readonly displayed = computed(() => [...stickyColumns, ...this.chosen()]);

  constructor() {
    effect(() => {
      const kept = this.preferences.candidateColumns();
      const storageKey = untracked(this.storageKey);
      if (kept) remember(storageKey, inTableOrder(kept));
      // chosen in this browser before the server kept choices: the server learns it once
      else if (kept === null) {
        const local = storedChoice(storageKey);
        if (local) untracked(() => this.preferences.saveCandidateColumns(local));
      }
    });
  }

  show(columns: readonly string[]): void {
    const wanted = inTableOrder(columns);
    this.chosen.set(wanted);
    remember(this.storageKey(), wanted);
    this.preferences.saveCandidateColumns(wanted);
  }
}

function inTableOrder(columns: readonly string[]): ChoosableColumn[] {
  return everyChoosable.filter((column) => columns.includes(column));
}

function remember(storageKey: string, columns: readonly ChoosableColumn[]): void {
  try {
    localStorage.setItem(storageKey, JSON.stringify(columns));
  } catch {
    // storage full or blocked: the server's copy still holds
  }
}

/** The choice this browser keeps for the user, or null when it keeps none. */
function storedChoice(storageKey: string): ChoosableColumn[] | null {
  try {
    const stored: unknown = JSON.parse(localStorage.getItem(storageKey) ?? 'null');
    if (Array.isArray(stored)) return inTableOrder(stored.filter((column) => typeof column === 'string'));
  } catch {
    // unreadable: as if none were kept
  }
  return null;
}
