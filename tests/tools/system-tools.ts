/**
 * Locating the system programs that some tests drive (Chromium, ngspice).
 *
 * A missing program never makes a test pass or vanish quietly: under CI (CI=true) the test fails
 * with the install command; on a developer machine it is skipped with a printed notice naming the
 * program and the command. `npm test` installs both first (tests/tools/ensure-system.mjs).
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export type SystemTool = 'chromium' | 'ngspice';

/** The command that installs a tool on Debian. */
export function installHint(tool: SystemTool): string {
  return `apt-get install -y --no-install-recommends ${tool} (or run npm test, which installs it)`;
}

/** Absolute path of the tool, or undefined when it is not installed. */
export function findTool(tool: SystemTool): string | undefined {
  const r = spawnSync('sh', ['-c', `command -v ${tool}`], { encoding: 'utf8' });
  const path = r.status === 0 ? r.stdout.trim() : '';
  return path && existsSync(path) ? path : undefined;
}

/** True when running under CI, where nothing may be skipped. */
export function inCi(): boolean {
  const v = process.env.CI;
  return v !== undefined && v !== '' && v !== '0' && v.toLowerCase() !== 'false';
}

/**
 * Whether tests needing `tool` should be skipped. Throws under CI when the tool is missing (so the
 * run fails); elsewhere prints why and returns true. Use with `describe.skipIf(skipWithout('x'))`.
 */
export function skipWithout(tool: SystemTool): boolean {
  if (findTool(tool)) return false;
  const message = `${tool} is not installed; install it with: ${installHint(tool)}`;
  if (inCi()) throw new Error(message);
  console.warn(`SKIPPED: the tests that need ${tool}. ${message}`);
  return true;
}

/** Path of the tool, or an error naming the install command (for use inside a running test). */
export function requireTool(tool: SystemTool): string {
  const path = findTool(tool);
  if (!path) throw new Error(`${tool} is not installed; install it with: ${installHint(tool)}`);
  return path;
}
