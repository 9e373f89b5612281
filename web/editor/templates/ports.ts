/**
 * The chain as the templates see it: the nominal port each element gives (its kind's `nominalOutput`
 * trait from the engine's registry, read from its own set-points, never solved), whether a port suits an
 * element (the engine's `accepts`), and the project's conventions (North American practice or not, its
 * mains frequency) that choose defaults. Part of the templates; web/editor/templates.ts is their entry.
 */
import { type ElementKind, KINDS, type NominalPort, type PortKind } from '../../../core/page.ts';
import type { DraftElement, DraftProject } from '../../state/editor.ts';

/** A port as the templates see it: its kind and, when known, nominal voltage (line-to-line on 3φ) and frequency. */
export type FeedingPort = NominalPort;

export const num = (v: unknown): number | undefined => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

/** US customary voltages on AC sources (common practice (no source)). */
const US_VOLTAGES = new Set([120, 208, 240, 277, 480, 600]);

/**
 * Does the project follow North American practice (conductors from the NEC tables, 60 Hz,
 * US service voltages)? Decides NEC vs IEC conductors and 60 vs 50 Hz for new stages.
 */
export function followsUsPractice(project: DraftProject | undefined): boolean {
  if (!project) return false;
  for (const e of project.elements) {
    const conductor = e['conductor'] as Record<string, unknown> | undefined;
    if (conductor && (conductor['system'] === 'nec' || /AWG|kcmil/i.test(String(conductor['size'] ?? '')))) return true;
    if (conductor && conductor['system'] === 'iec') return false;
  }
  const source = acSourcePort(project);
  if (source) return source.frequency === 60 || US_VOLTAGES.has(source.voltage ?? 0);
  return project.elements.some((e) => e.kind === 'inverter' && num(e['frequency']) === 60);
}

/**
 * The nominal output port of the project's AC source (the first element of a source kind whose
 * `nominalOutput` is AC), if it has one. The inverter's frequency is read by kind beside it: the
 * mains an inverter makes, where a drive's or converter's output frequency is a setting of its own.
 */
function acSourcePort(project: DraftProject | undefined): FeedingPort | undefined {
  for (const e of project?.elements ?? []) {
    if (KINDS.get(e.kind as ElementKind)?.role !== 'source') continue;
    const port = nominalOutput(e, null);
    if (port && (port.kind === 'ac1' || port.kind === 'ac3')) return port;
  }
  return undefined;
}

/** The mains frequency of the project: its AC source's, else its first inverter's, else 60 Hz for US practice and 50 Hz otherwise. */
export function projectFrequency(project: DraftProject | undefined): 50 | 60 {
  const f = acSourcePort(project)?.frequency ?? num(project?.elements.find((e) => e.kind === 'inverter')?.['frequency']);
  if (f === 50 || f === 60) return f;
  return followsUsPractice(project) ? 60 : 50;
}

/**
 * The nominal output port of an element fed at `input` (null for loads and for kinds or data it
 * cannot read): its kind's `nominalOutput` trait, read from the element's own set-points — what the
 * element is meant to give. A draft may hold anything: a trait that cannot read it gives null.
 */
export function nominalOutput(e: DraftElement, input: FeedingPort | null): FeedingPort | null {
  const spec = KINDS.get(e.kind as ElementKind);
  try {
    return spec?.nominalOutput?.(e as never, input) ?? null;
  } catch {
    return null;
  }
}

/** The nominal output port of every element of the project, walking from its source (loops and orphans are left out). */
export function nominalPorts(project: DraftProject): Map<string, FeedingPort> {
  const out = new Map<string, FeedingPort>();
  const inputs = new Map<string, FeedingPort | null>();
  const root = project.elements.find((e) => e.from === undefined);
  if (!root) return out;
  const seen = new Set<string>();
  const walk = (e: DraftElement, input: FeedingPort | null) => {
    if (seen.has(e.id)) return;
    seen.add(e.id);
    inputs.set(e.id, input);
    const port = nominalOutput(e, input);
    if (!port) return;
    out.set(e.id, port);
    for (const child of project.elements) if (child.from === e.id) walk(child, port);
  };
  walk(root, null);
  return out;
}

/** Does `element` accept a port of this kind (the engine's accepts)? */
export function acceptsPort(element: DraftElement, kind: PortKind): boolean {
  const spec = KINDS.get(element.kind as ElementKind);
  if (!spec) return false;
  try {
    return spec.accepts(element as never).includes(kind);
  } catch {
    return false;
  }
}

