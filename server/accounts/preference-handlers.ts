import type { RequestHandler } from 'express';
import type { Preferences, PreferencesInput } from '../../shared/api/api-schemas';
import { visibleTextProblem } from '../../shared/text-rules';
import { candidateColumns, type CandidateColumn } from '../../shared/vocabularies';
import { ProblemError } from '../api/problem-details';
import { UserPreference } from '../database/models';
import { currentUser } from './authenticated-user';

/*
 * Each user's preferences for how the pages are laid out, kept on the server so that they follow
 * the user to any browser. Only the caller's own row is ever read or written.
 */

function preferencesView(row: UserPreference | null): Preferences {
  if (!row) return { candidateColumns: null, updatedAt: null };
  return {
    candidateColumns: row.candidateColumns as CandidateColumn[] | null,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/**
 * The column ids as given, each checked: visible text under the shared rule (so that no control or
 * bidirectional character is echoed back), one of the table's columns, and not given before.
 */
export function checkedCandidateColumns(ids: readonly string[]): CandidateColumn[] {
  const known = new Set<string>(candidateColumns);
  const seen = new Set<string>();
  ids.forEach((id, index) => {
    const pointer = `/body/candidateColumns/${index}`;
    const textProblem = visibleTextProblem(id);
    if (textProblem)
      throw new ProblemError(422, 'Unknown column', `${pointer} ${textProblem}`, [{ pointer, detail: textProblem }]);
    if (!known.has(id))
      throw new ProblemError(422, 'Unknown column', `${pointer} "${id}" is not a column of the candidates table`, [
        { pointer, detail: `must be one of: ${candidateColumns.join(', ')}` },
      ]);
    if (seen.has(id))
      throw new ProblemError(422, 'Column given twice', `${pointer} "${id}" is already listed`, [
        { pointer, detail: `"${id}" is listed at an earlier index` },
      ]);
    seen.add(id);
  });
  return ids as CandidateColumn[];
}

export function createPreferenceHandlers(): Record<'getPreferences' | 'updatePreferences', RequestHandler> {
  return {
    getPreferences: async (request, response) => {
      response.json(preferencesView(await UserPreference.findByPk(currentUser(request).id)));
    },

    updatePreferences: async (request, response) => {
      const body = request.body as PreferencesInput;
      const columns = checkedCandidateColumns(body.candidateColumns);
      const userId = currentUser(request).id;
      // one row per user, written whole: the last save wins
      const [row] = await UserPreference.upsert({ userId, candidateColumns: columns });
      response.json(preferencesView(await row.reload()));
    },
  };
}
