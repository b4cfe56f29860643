import { HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { EMPTY, Subject, catchError, debounceTime, distinctUntilChanged, map, switchMap, tap } from 'rxjs';
import type { Preferences } from '../../../shared/api/api-schemas';
import { candidateColumns, type CandidateColumn } from '../../../shared/vocabularies';
import { PreferencesApi } from './preferences-api';
import { SessionService } from './session-service';

/** How long a choice rests before it is sent: a designer ticking five columns sends one save. */
export const PREFERENCE_SAVE_DELAY_MS = 600;

/** A save the server has not confirmed, as this browser keeps it. */
interface Unsent {
  candidateColumns: CandidateColumn[];
}

const unsentKey = (userId: number) => `riffle.preferences-unsent.${userId}`;

/**
 * The signed-in user's preferences as the server keeps them, loaded at each sign-in (and at start
 * with a restored session) so that they follow the user to any browser. Saves are sent once the
 * user stops changing them. A save the server has not yet taken (the page was closed first, or the
 * server could not be reached) waits in this browser and wins over the server's older copy at the
 * next load, which sends it again. A failed load or save changes nothing on the page.
 */
@Injectable({ providedIn: 'root' })
export class UserPreferences {
  private readonly api = inject(PreferencesApi);
  private readonly session = inject(SessionService);
  private readonly kept = signal<{ userId: number; preferences: Preferences } | null>(null);
  private readonly saves = new Subject<{ userId: number; input: Unsent }>();
  // counts the user's own changes, so that a load answered after one does not undo it
  private changes = 0;

  /**
   * The candidates table's shown columns the server keeps for the signed-in user: undefined until
   * it answers (or when it cannot be reached), null when the user never chose.
   */
  readonly candidateColumns = computed<readonly CandidateColumn[] | null | undefined>(() => {
    const kept = this.kept();
    return kept && kept.userId === this.session.user()?.id ? kept.preferences.candidateColumns : undefined;
  });

  constructor() {
    toObservable(this.session.user)
      .pipe(
        // each sign-in asks again, even by the same user: the load before may have met a revoked session
        distinctUntilChanged(),
        switchMap((user) => {
          if (user === null) return EMPTY;
          const userId = user.id;
          const changesBefore = this.changes;
          return this.api.getPreferences().pipe(
            map((preferences) => ({ userId, preferences, changed: this.changes !== changesBefore })),
            catchError(() => EMPTY),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe(({ userId, preferences, changed }) => {
        if (changed) return;
        const unsent = readUnsent(userId);
        this.kept.set({ userId, preferences: unsent ? { ...preferences, ...unsent } : preferences });
        if (unsent) this.saves.next({ userId, input: unsent });
      });

    this.saves
      .pipe(
        debounceTime(PREFERENCE_SAVE_DELAY_MS),
        // a save queued before a sign-out or a change of user is not sent under the next one
        switchMap(({ userId, input }) =>
          userId === this.session.user()?.id
            ? this.api.updatePreferences(input).pipe(
                tap(() => {
                  if (JSON.stringify(readUnsent(userId)) === JSON.stringify(input)) forget(unsentKey(userId));
                }),
                catchError((error: unknown) => {
                  // refused as it stands, it would be refused at every load: this browser drops it
                  if (error instanceof HttpErrorResponse && (error.status === 400 || error.status === 422))
                    forget(unsentKey(userId));
                  return EMPTY;
                }),
              )
            : EMPTY,
        ),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  /** Keeps the columns at once for this page and this browser, and on the server once the user stops changing them. */
  saveCandidateColumns(columns: readonly CandidateColumn[]): void {
    const userId = this.session.user()?.id;
    if (userId === undefined) return;
    this.changes++;
    const before = this.kept()?.userId === userId ? this.kept()!.preferences : null;
    const input: Unsent = { candidateColumns: [...columns] };
    this.kept.set({
      userId,
      preferences: { candidateColumns: input.candidateColumns, updatedAt: before?.updatedAt ?? null },
    });
    try {
      localStorage.setItem(unsentKey(userId), JSON.stringify(input));
    } catch {
      // storage full or blocked: the save is only as good as this page's life
    }
    this.saves.next({ userId, input });
  }
}

function readUnsent(userId: number): Unsent | null {
  try {
    const stored = JSON.parse(localStorage.getItem(unsentKey(userId)) ?? 'null') as {
      candidateColumns?: unknown;
    } | null;
    const ids: unknown = stored?.candidateColumns;
    if (Array.isArray(ids)) return { candidateColumns: candidateColumns.filter((column) => ids.includes(column)) };
  } catch {
    // unreadable: nothing waits
  }
  return null;
}

function forget(key: string): void {
  try {
    localStorage.removeItem(key);
  } catch {
    // blocked storage holds nothing to forget
  }
}
