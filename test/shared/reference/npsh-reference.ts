import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/*
 * Runs Debian's python3-fluids and python3-iapws on npsh_reference.py: the atmosphere and the
 * water's vapour pressure and density for the NPSH tests, from the libraries at test time.
 */

const SCRIPT = fileURLToPath(new URL('./npsh_reference.py', import.meta.url));
const PYTHON = '/usr/bin/python3';

export interface NpshReference {
  fluidsVersion: string;
  iapwsVersion: string;
  /** Pa absolute, one per elevation asked */
  atmosphere: number[];
  /** Pa absolute and kg/m3, one per temperature asked */
  water: Array<{ vapourPressure: number; density: number }>;
}

export function npshReference(elevations: readonly number[], temperatures: readonly number[]): NpshReference {
  const run = spawnSync(PYTHON, [SCRIPT], { input: JSON.stringify({ elevations, temperatures }), encoding: 'utf8' });
  if (run.error || run.status !== 0) {
    throw new Error(
      `python3-fluids/python3-iapws reference failed (apt-get install -y python3-fluids python3-iapws): ${run.error?.message ?? run.stderr}`,
    );
  }
  return JSON.parse(run.stdout) as NpshReference;
}
