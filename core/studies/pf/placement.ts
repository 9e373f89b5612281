/**
 * Where a power-factor correction bank belongs, and where it does not. Pure, light (types only from
 * the solve), so the page can list the places without loading the engine.
 *
 * Rules (common practice in capacitor application guides, e.g. IEEE Std 1036 on harmonic resonance;
 * the drive and inverter makers' manuals forbid capacitors on their outputs):
 * - never on a drive's output, nor at a motor or load a drive feeds (the same bus, through cables or
 *   transformers): the output is pulse-width modulated, its switching edges drive large currents
 *   into capacitors (they overheat, the drive trips on overcurrent), and the drive already supplies
 *   the motor's reactive power from its DC link, so nothing upstream changes;
 * - not proposed on an inverter's output (or a load it feeds): the inverter supplies the reactive
 *   power from its DC side, so a bank there lowers nothing upstream, adds capacitive current its
 *   output filter and control must carry, and can resonate with that filter; a bank asked for there
 *   is computed with that warning;
 * - beside a drive's input (the bus that feeds a drive): the drive's input power factor is set by its
 *   rectifier (near unity displacement; the rest is harmonic distortion, which capacitors do not
 *   correct), and capacitors on that bus can resonate with the supply at a harmonic the rectifier
 *   draws: a warning says so (detuned banks, or the drive's own line reactor or filter).
 */
import type { ElementResult, PortResult, SolveResult } from '../../model/result.ts';

/** The target power factor the page offers first (common practice: many tariffs bill below 0.95). */
export const DEFAULT_TARGET_POWER_FACTOR = 0.95;

/** Series links that pass an AC bus on to what they feed. */
const PASSIVE = new Set(['cable', 'transformer']);

/** The AC port a bank at this element corrects: a source's or AC-output stage's output, else its input. */
export function correctedPort(e: ElementResult): { side: 'input' | 'output'; port: PortResult | undefined } {
  const acOut = e.output && (e.output.kind === 'ac1' || e.output.kind === 'ac3');
  return e.role === 'source' || (e.role === 'stage' && acOut) ? { side: 'output', port: e.output } : { side: 'input', port: e.input };
}

const isAc = (p: PortResult | undefined): p is PortResult => !!p && (p.kind === 'ac1' || p.kind === 'ac3');

/** The drive or inverter whose output the bank's bus is (through cables and transformers), if any. */
export function converterOutputAt(byId: ReadonlyMap<string, ElementResult>, e: ElementResult, side: 'input' | 'output'): ElementResult | undefined {
  for (let id = side === 'output' ? e.id : e.from; id !== undefined; ) {
    const x = byId.get(id);
    if (!x) return undefined;
    if (x.kind === 'drive' || x.kind === 'inverter') return x;
    if (!PASSIVE.has(x.kind)) return undefined;
    id = x.from;
  }
  return undefined;
}

/** Drives fed from the bank's bus (directly or through cables and transformers). */
export function drivesOnBus(byId: ReadonlyMap<string, ElementResult>, busId: string): ElementResult[] {
  // Depth first with a stack (no recursion on depth), in the order the feeds list them.
  const out: ElementResult[] = [];
  const stack = [...(byId.get(busId)?.feeds ?? [])].reverse();
  while (stack.length) {
    const x = byId.get(stack.pop()!);
    if (x?.kind === 'drive') out.push(x);
    else if (x && PASSIVE.has(x.kind)) for (let j = x.feeds.length - 1; j >= 0; j--) stack.push(x.feeds[j]!);
  }
  return out;
}

export const DRIVE_OUTPUT_REASON =
  'a drive’s output is pulse-width modulated: its switching edges drive large currents into capacitors (they overheat, the drive trips on overcurrent), and the drive already supplies the motor’s reactive power from its DC link, so nothing upstream would change; the drive’s input power factor is set by its rectifier';
export const INVERTER_OUTPUT_REASON =
  'the inverter supplies the reactive power from its DC side, so a bank on its output lowers nothing upstream; it adds capacitive current the inverter’s output filter and control must carry and can resonate with that filter (check with the inverter maker)';
export const DRIVE_INPUT_REASON =
  'a drive’s input power factor is set by its rectifier (near unity displacement; the rest is harmonic distortion, which capacitors do not correct), and capacitors on the bus that feeds it can resonate with the supply at a harmonic the rectifier draws: use a detuned bank (with reactors), or the drive’s own line reactor or filter';

/** One place a bank could go. */
export interface PfCandidate {
  id: string;
  name: string;
  side: 'input' | 'output';
  powerFactor: number;
  pfSense: 'lagging' | 'leading' | 'unity';
  /** False where a bank does not belong (a drive or inverter output): `reason` says why. */
  offered: boolean;
  /** Offered, drawing real power, lagging and below the target: a bank would do something. */
  needed: boolean;
  reason?: string;
}

/** Every AC interface of a solved chain, with whether a bank belongs there and is needed at `target`. */
export function pfCorrectionCandidates(result: SolveResult, target: number = DEFAULT_TARGET_POWER_FACTOR): PfCandidate[] {
  const byId = new Map(result.elements.map((e) => [e.id, e]));
  const out: PfCandidate[] = [];
  for (const e of result.elements) {
    const { side, port } = correctedPort(e);
    if (!isAc(port)) continue;
    const conv = converterOutputAt(byId, e, side);
    const offered = !conv;
    const reason = conv ? `on the output of ${conv.kind === 'drive' ? 'the drive' : 'the inverter'} ${conv.name}: ${conv.kind === 'drive' ? DRIVE_OUTPUT_REASON : INVERTER_OUTPUT_REASON}` : undefined;
    // A pf equal to the target within rounding (0.9499999… against 0.95) needs no bank.
    const needed = offered && port.p > 0 && port.pfSense === 'lagging' && port.powerFactor < target - 1e-6;
    out.push({ id: e.id, name: e.name, side, powerFactor: port.powerFactor, pfSense: port.pfSense, offered, needed, ...(reason ? { reason } : {}) });
  }
  return out;
}
