#!/usr/bin/env node
// Makes sure the system programs the tests drive are installed: a real browser (Debian `chromium`)
// and the reference circuit simulator (`ngspice`). Installs them from Debian when missing and this
// process may do so (root); otherwise stops with one line naming what is missing and how to get it.
import { spawnSync } from 'node:child_process';

const PACKAGES = ['chromium', 'ngspice'];

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

const missing = PACKAGES.filter((p) => !onPath(p));
if (missing.length === 0) process.exit(0);

const installCommand = `sudo apt-get update && sudo apt-get install -y --no-install-recommends ${missing.join(' ')}`;
const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
if (!isRoot || !onPath('apt-get')) {
  console.error(`Missing system programs: ${missing.join(', ')}; install them with: ${installCommand}`);
  process.exit(1);
}

console.log(`Installing ${missing.join(', ')} from Debian…`);
const ok =
  run('apt-get', ['update', '-qq']) &&
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing]);
const stillMissing = PACKAGES.filter((p) => !onPath(p));
if (!ok || stillMissing.length > 0) {
  const names = (stillMissing.length ? stillMissing : missing).join(', ');
  console.error(`Missing system programs: ${names} (apt-get did not install them); install them with: ${installCommand}`);
  process.exit(1);
}
