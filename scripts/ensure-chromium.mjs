// Makes Debian's Chromium available for the browser tests: returns its path, installing the `chromium`
// apt package first when it is missing and this process may (root with apt-get), else throws with the
// command to run. Called from the browser tests' setup; .ci/run installs the same package.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Launch flags: no sandbox (containers), and nothing that phones home. */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

const INSTRUCTION = `Chromium is needed for the browser tests. Install it with: sudo apt-get update && sudo apt-get install -y chromium (or set CHROMIUM_PATH to a Chromium binary).`;

export function ensureChromium() {
  if (existsSync(CHROMIUM_PATH)) return CHROMIUM_PATH;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  const hasApt = existsSync('/usr/bin/apt-get');
  if (!isRoot || !hasApt || process.env.CHROMIUM_PATH) throw new Error(`${CHROMIUM_PATH} not found. ${INSTRUCTION}`);
  console.log('Chromium is missing: installing the Debian package (apt-get install chromium)...');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  try {
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env });
  } catch (e) {
    throw new Error(`installing chromium failed (${e instanceof Error ? e.message : String(e)}). ${INSTRUCTION}`);
  }
  if (!existsSync(CHROMIUM_PATH)) throw new Error(`apt-get finished but ${CHROMIUM_PATH} is still missing. ${INSTRUCTION}`);
  return CHROMIUM_PATH;
}
