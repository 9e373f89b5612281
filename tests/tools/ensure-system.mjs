#!/usr/bin/env node
// Makes sure the system programs the tests drive are installed: a real browser (Debian `chromium`),
// the reference circuit simulator (`ngspice`) and poppler's `pdftoppm` (the printed reports' pages as
// images, Debian `poppler-utils`). Installs them from Debian when missing and this process may do so
// (root); otherwise stops with one line naming what is missing and how to get it.
import { spawnSync } from 'node:child_process';

/** Each program the tests run, and the Debian package that brings it. */
const TOOLS = [
  { program: 'chromium', pkg: 'chromium' },
  { program: 'ngspice', pkg: 'ngspice' },
  { program: 'pdftoppm', pkg: 'poppler-utils' },
];

/** True when `name` is an executable on PATH. */
function onPath(name) {
  return spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0;
}

function run(cmd, args) {
  const r = spawnSync(cmd, args, {
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  return r.status === 0;
}

const absent = () => TOOLS.filter((t) => !onPath(t.program));
const missing = absent();
if (missing.length === 0) process.exit(0);

const packages = missing.map((t) => t.pkg);
const names = (list) => list.map((t) => (t.program === t.pkg ? t.program : `${t.program} (${t.pkg})`)).join(', ');
const installCommand = `sudo apt-get update && sudo apt-get install -y --no-install-recommends ${packages.join(' ')}`;
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
if (!isRoot || !onPath('apt-get')) {
  console.error(`Missing system programs: ${names(missing)}; install them with: ${installCommand}`);
  process.exit(1);
}

console.log(`Installing ${packages.join(', ')} from Debian…`);
const ok =
  run('apt-get', ['update', '-qq']) &&
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages]);
const stillMissing = absent();
if (!ok || stillMissing.length > 0) {
  console.error(`Missing system programs: ${names(stillMissing.length ? stillMissing : missing)} (apt-get did not install them); install them with: ${installCommand}`);
  process.exit(1);
}
