/**
 * Locating the system programs that some tests drive (Chromium, ngspice, pdftoppm).
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

/**
 * Each page of a printed PDF as an image to look at (poppler's pdftoppm, Debian poppler-utils, which
 * tests/tools/ensure-system.mjs installs). Under CI (CI=true) a missing pdftoppm fails the test with one
 * line; elsewhere the test's output says the images are skipped. A pdftoppm that fails on the PDF fails it.
 */
export function pdfPageImages(pdf: string, prefix: string): void {
  const r = spawnSync('pdftoppm', ['-png', '-r', '60', pdf, prefix], { encoding: 'utf8' });
  if ((r.error as NodeJS.ErrnoException | undefined)?.code === 'ENOENT') {
    const message = 'pdftoppm is not installed; install it with: apt-get install -y --no-install-recommends poppler-utils (or run npm test, which installs it)';
    if (inCi()) throw new Error(message);
    console.warn(`SKIPPED: the printed report's page images (${prefix}-*.png): ${message}`);
    return;
  }
  if (r.error || r.status !== 0) throw new Error(`pdftoppm could not turn ${pdf} into images: ${r.error?.message ?? r.stderr.trim().split('\n')[0]}`);
}
