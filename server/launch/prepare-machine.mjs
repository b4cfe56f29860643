// Installs what Riffle needs on a fresh Debian machine before anything else runs:
// Debian packages (through apt-get) and the npm dependencies (through npm ci).
// Plain Node with no dependencies, because node_modules may not exist yet.
// Usage: node server/launch/prepare-machine.mjs start|test
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const projectRoot = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Debian packages each command needs, with the reason shown to the user. */
const debianPackagesFor = {
  start: { 'mariadb-server': 'the database server' },
  test: {
    'mariadb-server': 'the database server',
    chromium: 'the browser for browser tests',
    'python3-fluids': 'reference values for the hydraulics tests',
    'python3-iapws': 'reference values for the water-property tests',
  },
};

/** Package lists older than this are refreshed before installing. */
const aptListsMaxAgeMs = 7 * 24 * 3600 * 1000;

function fail(message) {
  console.error(`riffle: ${message}`);
  process.exit(1);
}

function isDebianPackageInstalled(name) {
  const result = spawnSync('dpkg-query', ['-W', '-f=${Status}', name], { encoding: 'utf8' });
  return result.status === 0 && result.stdout.includes('install ok installed');
}

function aptListsAreFresh() {
  const listsDir = '/var/lib/apt/lists';
  if (!existsSync(listsDir)) return false;
  const lists = readdirSync(listsDir).filter((name) => name.endsWith('_Packages') || name.includes('_Packages.'));
  if (lists.length === 0) return false;
  const newest = Math.max(...lists.map((name) => statSync(join(listsDir, name)).mtimeMs));
  return Date.now() - newest < aptListsMaxAgeMs;
}

function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', cwd: projectRoot, ...options });
  if (result.error) fail(`could not run ${command}: ${result.error.message}`);
  if (result.status !== 0) fail(`${command} ${args.join(' ')} failed with exit code ${result.status}`);
}

function ensureDebianPackages(purpose) {
  const wanted = debianPackagesFor[purpose];
  const missing = Object.keys(wanted).filter((name) => !isDebianPackageInstalled(name));
  if (missing.length === 0) return;
  const installCommand = `apt-get update && apt-get install -y --no-install-recommends ${missing.join(' ')}`;
  if (process.getuid?.() !== 0) {
    fail(`missing Debian packages: ${missing.join(', ')}. Run as root: ${installCommand}`);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const name of missing) console.log(`riffle: installing Debian package ${name} (${wanted[name]})`);
  if (!aptListsAreFresh()) {
    console.log('riffle: package lists are missing or stale; running apt-get update');
    run('apt-get', ['update'], { env });
  }
  run('apt-get', ['-o', 'DPkg::Lock::Timeout=300', 'install', '-y', '--no-install-recommends', ...missing], { env });
}

function lockFileHash() {
  const lockPath = join(projectRoot, 'package-lock.json');
  if (!existsSync(lockPath)) fail('package-lock.json is missing; restore it from the repository');
  return createHash('sha256').update(readFileSync(lockPath)).update(process.version).digest('hex');
}

function ensureNpmDependencies() {
  const stampPath = join(projectRoot, 'node_modules', '.riffle-installed-lock');
  const wantedHash = lockFileHash();
  const installedHash = existsSync(stampPath) ? readFileSync(stampPath, 'utf8').trim() : '';
  if (installedHash === wantedHash) return;
  console.log(
    existsSync(join(projectRoot, 'node_modules'))
      ? 'riffle: npm dependencies are stale; running npm ci'
      : 'riffle: npm dependencies are missing; running npm ci',
  );
  run('npm', ['ci', '--no-audit', '--no-fund'], { shell: false });
  writeFileSync(stampPath, `${wantedHash}\n`);
}

function checkNodeVersion() {
  const [major, minor] = process.versions.node.split('.').map(Number);
  if (major < 20 || (major === 20 && minor < 19)) {
    fail(`Node ${process.versions.node} is too old; Riffle needs Node 20.19 or newer`);
  }
}

const purpose = process.argv[2];
if (!(purpose in debianPackagesFor)) {
  fail(`unknown purpose "${purpose}"; expected one of: ${Object.keys(debianPackagesFor).join(', ')}`);
}
checkNodeVersion();
try {
  execFileSync('dpkg-query', ['--version'], { stdio: 'ignore' });
} catch {
  fail('dpkg-query was not found: Riffle installs its services from Debian packages and needs Debian 12 or a relative');
}
ensureDebianPackages(purpose);
ensureNpmDependencies();
