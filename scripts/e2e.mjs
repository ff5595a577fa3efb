// End-to-end tests: builds the web renderer (and the Electron build when its runtime is
// installed), checks that Chromium is there, then runs Playwright. Extra arguments go to
// `playwright test` (e.g. `node scripts/e2e.mjs e2e/smoke.spec.ts`).
import { existsSync } from 'node:fs';
import { electronBinary, run } from './electron-runtime.mjs';

const chromium = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Installs Debian's Chromium when this is a Debian machine and we may (root, apt-get present). */
async function installChromium() {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot || !existsSync('/usr/bin/apt-get') || process.env.CHROMIUM_PATH) return false;
  console.log("Chromium is missing: installing Debian's chromium package for the end-to-end tests…");
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if ((await run('apt-get', ['update', '-qq'], { env })) !== 0) return false;
  return (await run('apt-get', ['install', '-y', '-qq', 'chromium'], { env })) === 0 && existsSync(chromium);
}

if (!existsSync(chromium) && !(await installChromium())) {
  console.error([
    `Chromium was not found at ${chromium}; the end-to-end tests drive Debian's Chromium.`,
    'Install it with:',
    '',
    '    apt-get update && apt-get install -y chromium',
    '',
    'or point CHROMIUM_PATH at another Chromium binary.',
  ].join('\n'));
  process.exit(1);
}

console.log('Building the web renderer (dist-web)…');
let code = await run('npx', ['vite', 'build', '--config', 'vite.web.config.ts']);
if (code !== 0) process.exit(code);

if (electronBinary()) {
  console.log('Building the Electron app (out/)…');
  code = await run('npx', ['electron-vite', 'build']);
  if (code !== 0) process.exit(code);
} else {
  console.log('The Electron runtime is not installed on this machine: the electron project\'s tests will be skipped.');
}

process.exit(await run('npx', ['playwright', 'test', ...process.argv.slice(2)]));
