import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/*
 * Runs Debian's python3-fluids (apt-get install -y python3-fluids) on
 * fluids_reference.py and returns its JSON answer. Reference values in the
 * tests come from the library at test time, never typed in.
 */

const SCRIPT = fileURLToPath(new URL('./fluids_reference.py', import.meta.url));
const PYTHON = '/usr/bin/python3';

export interface FluidsRequest {
  colebrook?: [number, number][];
  swameeJain?: [number, number][];
  pipes?: [string, number][];
  crane?: number[];
  frictionFactor?: [number, number][];
  /** [diameter ratio, included angle in degrees] */
  diameterChanges?: [number, number][];
}

export type CraneValues = Record<
  | 'ft'
  | 'elbow90'
  | 'elbow45'
  | 'return180'
  | 'bend90rd1'
  | 'bend90rd15'
  | 'liftCheckInline'
  | 'plugThreeWayRun'
  | 'plugThreeWayBranch'
  | 'teeAsElbow'
  | 'gate'
  | 'ball'
  | 'globe'
  | 'butterfly'
  | 'swingCheck'
  | 'swingCheckClearway'
  | 'footValvePoppet'
  | 'footValveHinged'
  | 'entranceSharp'
  | 'entranceInward'
  | 'exit',
  number
>;

export interface FluidsAnswer {
  fluidsVersion: string;
  colebrook: number[];
  swameeJain: number[];
  /** [inside diameter, outside diameter], m */
  pipes: [number, number][];
  crane: CraneValues[];
  frictionFactor: number[];
  diameterChanges: { contraction: number; enlargement: number }[];
}

export function fluidsReference(request: FluidsRequest): FluidsAnswer {
  const run = spawnSync(PYTHON, [SCRIPT], { input: JSON.stringify(request), encoding: 'utf8' });
  if (run.error || run.status !== 0) {
    throw new Error(
      `python3-fluids reference failed (install it with: apt-get install -y python3-fluids): ${run.error?.message ?? run.stderr}`,
    );
  }
  return JSON.parse(run.stdout) as FluidsAnswer;
}
