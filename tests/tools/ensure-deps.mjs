#!/usr/bin/env node
// Before `npm start`: installs the npm packages from the lock file when they are absent (a fresh
// clone), so the dev server never starts half-installed. Does nothing when they are present.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const needed = ['vite', 'preact', '@preact/signals', '@preact/preset-vite'];
const absent = needed.filter((name) => !existsSync(new URL(`../../node_modules/${name}/package.json`, import.meta.url)));
if (absent.length > 0) {
  console.log(`Installing npm packages (missing: ${absent.join(', ')})…`);
  const r = spawnSync('npm', ['ci'], { stdio: 'inherit', cwd: new URL('../..', import.meta.url) });
  process.exit(r.status ?? 1);
}
