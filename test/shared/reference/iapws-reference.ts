import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/*
 * Runs Debian's python3-iapws (apt-get install -y python3-iapws) on iapws_reference.py and
 * returns its JSON answer: the water-property tests take their reference values from the
 * library at test time, never typed in.
 */

const SCRIPT = fileURLToPath(new URL('./iapws_reference.py', import.meta.url));
const PYTHON = '/usr/bin/python3';

export interface IapwsWater {
  /** kg/m3 at 101.325 kPa */
  density: number;
  /** Pa s at 101.325 kPa */
  viscosity: number;
  /** Pa absolute */
  vapourPressure: number;
}

export interface IapwsAnswer {
  iapwsVersion: string;
  water: IapwsWater[];
}

export function iapwsReference(temperatures: readonly number[]): IapwsAnswer {
  const run = spawnSync(PYTHON, [SCRIPT], { input: JSON.stringify({ temperatures }), encoding: 'utf8' });
  if (run.error || run.status !== 0) {
    throw new Error(
      `python3-iapws reference failed (install it with: apt-get install -y python3-iapws): ${run.error?.message ?? run.stderr}`,
    );
  }
  return JSON.parse(run.stdout) as IapwsAnswer;
}
