import { HydraulicsInputError, type EngineInputError } from '../../shared/hydraulics';

/** The code, values and pointer of the refusal `compute` throws; fails when it throws none or another error. */
export function refusalOf(compute: () => unknown): EngineInputError {
  try {
    compute();
  } catch (error) {
    if (error instanceof HydraulicsInputError) return error.issue;
    throw error;
  }
  throw new Error('expected a HydraulicsInputError, but nothing was thrown');
}
