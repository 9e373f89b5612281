/**
 * A small runner for the ngspice circuit simulator (the outside reference for the AC solve).
 *
 * Netlist text in, named complex results out: `runAc(netlist, frequency, ['v(a)', 'i(vsrc)'])`
 * adds a `.control` block with a single-frequency AC analysis (`ac lin 1 f f`) and `wrdata`, runs
 * `ngspice -b` (via spawnSync) in a temporary directory and parses the file. `wrdata` writes, per data row, for each
 * complex vector the scale (frequency) followed by the real and imaginary parts, so one row holds
 * 3 columns per requested vector.
 *
 * SPICE conventions worth remembering:
 * - AC source magnitudes are taken as given; with amplitude = rms value every result is an rms phasor.
 * - i(Vname) is the current flowing INTO the source's + terminal through the source to its − terminal,
 *   so the current a source delivers to the circuit is −i(Vname).
 *
 * A missing ngspice never passes quietly: `requireNgspice()` throws a one-line message with the
 * install command (in CI and on a developer machine alike).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface Phasor {
  re: number;
  im: number;
}

export const NGSPICE_MISSING = 'ngspice is not installed (needed for the reference tests): apt-get install -y ngspice';

/** Absolute path of ngspice, or throws the one-line install message. */
export function requireNgspice(): string {
  const r = spawnSync('sh', ['-c', 'command -v ngspice'], { encoding: 'utf8' });
  const path = r.status === 0 ? r.stdout.trim() : '';
  if (!path) throw new Error(NGSPICE_MISSING);
  return path;
}

/** Run a single-frequency AC analysis and return each requested vector as a complex rms phasor. */
export function runAc(netlist: string, frequency: number, vectors: readonly string[]): Record<string, Phasor> {
  const ngspice = requireNgspice();
  const dir = mkdtempSync(join(tmpdir(), 'joulepath-spice-'));
  try {
    const out = join(dir, 'out.txt');
    const deck = [
      '* joulepath reference circuit',
      netlist.trim(),
      '.control',
      `ac lin 1 ${frequency} ${frequency}`,
      // Full precision in the written numbers (the default is 8 digits after the point).
      'set wr_singlescale',
      'option numdgt=15',
      `wrdata ${out} ${vectors.join(' ')}`,
      // Leave batch mode from here: otherwise ngspice looks for dot-analyses, finds none, exits 1.
      'quit 0',
      '.endc',
      '.end',
      '',
    ].join('\n');
    const cir = join(dir, 'circuit.cir');
    writeFileSync(cir, deck);
    const run = spawnSync(ngspice, ['-b', cir], { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    const log = `${run.stdout ?? ''}\n${run.stderr ?? ''}`;
    if (run.status !== 0 || /\berror\b/i.test(log)) {
      throw new Error(`ngspice failed (exit ${run.status}):\n${log}\n--- deck ---\n${deck}`);
    }
    let text: string;
    try {
      text = readFileSync(out, 'utf8');
    } catch {
      throw new Error(`ngspice wrote no results:\n${log}\n--- deck ---\n${deck}`);
    }
    const nums = text.trim().split(/\s+/).map(Number);
    // With wr_singlescale: the scale once, then re/im per vector.
    if (nums.length !== 1 + 2 * vectors.length || nums.some((n) => !Number.isFinite(n))) {
      throw new Error(`unexpected wrdata output (${nums.length} numbers for ${vectors.length} vectors):\n${text}`);
    }
    if (Math.abs(nums[0]! - frequency) > 1e-9 * frequency) throw new Error(`ngspice solved at ${nums[0]} Hz, not ${frequency} Hz`);
    const result: Record<string, Phasor> = {};
    vectors.forEach((name, k) => {
      result[name] = { re: nums[1 + 2 * k]!, im: nums[2 + 2 * k]! };
    });
    return result;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** SPICE number with full double precision. */
export const sp = (x: number): string => x.toPrecision(17);

/**
 * A series R + L (lagging, X ≥ 0) or R + C (leading, X < 0) branch between two nodes, for an
 * impedance R + jX at frequency f. Element names are prefixed with `name`; `mid` is a fresh node.
 * L = X/(2πf); C = 1/(2πf·|X|). A zero part is left out.
 */
export function seriesBranch(name: string, a: string, b: string, r: number, x: number, f: number): string {
  const w = 2 * Math.PI * f;
  const lines: string[] = [];
  if (x === 0) {
    lines.push(`R${name} ${a} ${b} ${sp(r)}`);
  } else if (r === 0) {
    lines.push(x > 0 ? `L${name} ${a} ${b} ${sp(x / w)}` : `C${name} ${a} ${b} ${sp(1 / (w * -x))}`);
  } else {
    const mid = `${name}_m`;
    lines.push(`R${name} ${a} ${mid} ${sp(r)}`);
    lines.push(x > 0 ? `L${name} ${mid} ${b} ${sp(x / w)}` : `C${name} ${mid} ${b} ${sp(1 / (w * -x))}`);
  }
  return lines.join('\n');
}
