/**
 * The circuit of a load given by its elements, as the form edits it: a tree of groups (parts in
 * series or in parallel, nested as deep as the engine takes them) and parts (a resistor, an inductor
 * or a capacitor with its value). The file holds the network as the engine reads it
 * (core/model/circuit-network.ts: `{ series: [...] } | { parallel: [...] } | { resistor|inductor|capacitor: value }`);
 * `networkToTree` and `treeToNetwork` turn one into the other and back without changing it.
 *
 * Values are typed in the user's number format ("4,7 mH" in de-DE) and stored as the engine's text
 * (a point for the decimals: "4.7 mH"), which keeps the prefix and unit the user wrote; the engine
 * checks the prefix and unit (core/physics/si-prefix.ts). Pure: no DOM, no engine, no signals.
 */
import type { ComponentValue } from '../../../core/page.ts';
import { formatForInput, localeSeparators, parseLocaleNumber } from '../../format/parse.ts';
import { UNIT_GAP, formatPowerFactor, formatSignificant, formatWithPrefix } from '../../format/number.ts';

export type PartKind = 'resistor' | 'inductor' | 'capacitor';
export type Join = 'series' | 'parallel';

export interface PartNode {
  type: 'part';
  kind: PartKind;
  /** The value as stored (a number in Ω, H or F, or text with an SI prefix; anything from a damaged file). */
  value: unknown;
}
export interface GroupNode {
  type: 'group';
  join: Join;
  items: TreeNode[];
}
export type TreeNode = PartNode | GroupNode;

/** The whole circuit: always a group at the top; `bare` when the file holds one part alone (no group). */
export interface CircuitTree {
  root: GroupNode;
  bare: boolean;
}

/** Where a node is: its index in each group from the top (the top group itself is []). */
export type NodePath = readonly number[];

export const PART_KINDS: readonly { kind: PartKind; label: string; unit: 'Ω' | 'H' | 'F' }[] = [
  { kind: 'resistor', label: 'Resistor', unit: 'Ω' },
  { kind: 'inductor', label: 'Inductor', unit: 'H' },
  { kind: 'capacitor', label: 'Capacitor', unit: 'F' },
];
const KIND_SET = new Set<string>(PART_KINDS.map((p) => p.kind));
export const partLabel = (kind: PartKind): string => PART_KINDS.find((p) => p.kind === kind)!.label;
export const partUnit = (kind: PartKind): 'Ω' | 'H' | 'F' => PART_KINDS.find((p) => p.kind === kind)!.unit;

/** The value a new part, or a part whose kind is changed, starts with (a common size; the user sets their own). */
export const DEFAULT_VALUE: Readonly<Record<PartKind, string>> = { resistor: '10 Ω', inductor: '10 mH', capacitor: '100 µF' };

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

// ---------- file ↔ tree ----------

/** One node of a network, or undefined when its shape is not one the form can show (a damaged file). */
function nodeOf(raw: unknown, depth: number): TreeNode | undefined {
  if (!isRecord(raw) || depth > 64) return undefined;
  const keys = Object.keys(raw);
  if (keys.length !== 1) return undefined;
  const key = keys[0]!;
  if (KIND_SET.has(key)) return { type: 'part', kind: key as PartKind, value: raw[key] };
  if (key !== 'series' && key !== 'parallel') return undefined;
  const list = raw[key];
  if (!Array.isArray(list)) return undefined;
  const items = list.map((x) => nodeOf(x, depth + 1));
  return items.every((x) => x !== undefined) ? { type: 'group', join: key, items: items as TreeNode[] } : undefined;
}

/** The form's tree of a stored network, or undefined when its shape cannot be shown as a tree (then only as text). */
export function networkToTree(raw: unknown): CircuitTree | undefined {
  const node = nodeOf(raw, 0);
  if (!node) return undefined;
  return node.type === 'part' ? { root: { type: 'group', join: 'series', items: [node] }, bare: true } : { root: node, bare: false };
}

function nodeToNetwork(node: TreeNode): unknown {
  return node.type === 'part' ? { [node.kind]: node.value } : { [node.join]: node.items.map(nodeToNetwork) };
}

/** The network the file holds for a tree: a lone part stays a lone part until a second one joins it. */
export function treeToNetwork(tree: CircuitTree): unknown {
  const only = tree.root.items[0];
  if (tree.bare && tree.root.items.length === 1 && only?.type === 'part') return nodeToNetwork(only);
  return nodeToNetwork(tree.root);
}

/** The path in the file, below the network field, of a node's value (a part) or its list (a group). */
export function filePath(tree: CircuitTree, path: NodePath): string {
  const only = tree.root.items[0];
  if (tree.bare && tree.root.items.length === 1 && only?.type === 'part') return path.length === 0 ? '' : only.kind;
  const segments: (string | number)[] = [];
  let node: TreeNode = tree.root;
  for (const i of path) {
    if (node.type !== 'group') break;
    segments.push(node.join, i);
    node = node.items[i]!;
  }
  segments.push(node.type === 'part' ? node.kind : node.join);
  return segments.join('.');
}

// ---------- reading the tree ----------

export function nodeAt(tree: CircuitTree, path: NodePath): TreeNode | undefined {
  let node: TreeNode | undefined = tree.root;
  for (const i of path) node = node?.type === 'group' ? node.items[i] : undefined;
  return node;
}

/** How many parts the circuit holds. */
export function countParts(node: TreeNode): number {
  return node.type === 'part' ? 1 : node.items.reduce((n, x) => n + countParts(x), 0);
}

const number = (path: NodePath) => path.map((i) => i + 1).join('.');
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** A group's name: "the circuit" at the top, else "parallel group 2" / "series group 2.1" by its place. */
export function groupName(tree: CircuitTree, path: NodePath): string {
  if (path.length === 0) return 'the circuit';
  const node = nodeAt(tree, path);
  return `${node?.type === 'group' ? node.join : 'series'} group ${number(path)}`;
}

/**
 * A node's name as a screen reader and a message say it: "Resistor 1 of the circuit", "Inductor 2 of
 * parallel group 3" (its place in its group), or a group's own name, "Parallel group 3".
 */
export function nodeName(tree: CircuitTree, path: NodePath): string {
  const node = nodeAt(tree, path);
  if (!node || path.length === 0) return capital(groupName(tree, path));
  if (node.type === 'group') return capital(groupName(tree, path));
  return `${partLabel(node.kind)} ${path[path.length - 1]! + 1} of ${groupName(tree, path.slice(0, -1))}`;
}

/** The number shown beside a node: its place from the top ("2.1"). */
export const placeNumber = number;

// ---------- changing the tree (each returns a new tree; the old one is left as it was) ----------

function replaceAt(node: GroupNode, path: NodePath, change: (n: TreeNode) => TreeNode | undefined): GroupNode {
  if (path.length === 0) return change(node) as GroupNode;
  const [i, ...rest] = path;
  const items = node.items.flatMap((item, j) => {
    if (j !== i) return [item];
    if (rest.length === 0) {
      const next = change(item);
      return next ? [next] : [];
    }
    return item.type === 'group' ? [replaceAt(item, rest, change)] : [item];
  });
  return { ...node, items };
}

const withRoot = (tree: CircuitTree, root: GroupNode): CircuitTree => ({ root, bare: tree.bare });

/** A part added at the end of a group; returns the tree and the new part's path. */
export function addPart(tree: CircuitTree, group: NodePath, kind: PartKind = 'resistor'): { tree: CircuitTree; path: NodePath } {
  const g = nodeAt(tree, group);
  if (g?.type !== 'group') return { tree, path: group };
  const root = replaceAt(tree.root, group, (n) => ({ ...(n as GroupNode), items: [...(n as GroupNode).items, { type: 'part', kind, value: DEFAULT_VALUE[kind] }] }));
  return { tree: withRoot(tree, root), path: [...group, g.items.length] };
}

/**
 * A group added at the end of a group: the other connection than its parent's (parts in parallel
 * inside a series circuit), holding one part to start with.
 */
export function addGroup(tree: CircuitTree, group: NodePath): { tree: CircuitTree; path: NodePath } {
  const g = nodeAt(tree, group);
  if (g?.type !== 'group') return { tree, path: group };
  const fresh: GroupNode = { type: 'group', join: g.join === 'series' ? 'parallel' : 'series', items: [{ type: 'part', kind: 'resistor', value: DEFAULT_VALUE.resistor }] };
  const root = replaceAt(tree.root, group, (n) => ({ ...(n as GroupNode), items: [...(n as GroupNode).items, fresh] }));
  return { tree: withRoot(tree, root), path: [...group, g.items.length] };
}

/** Why a node cannot be removed, or null: a group keeps one entry at least (the engine takes no empty group). */
export function whyNotRemove(tree: CircuitTree, path: NodePath): string | null {
  if (path.length === 0) return 'The circuit itself cannot be removed';
  const parent = nodeAt(tree, path.slice(0, -1));
  if (parent?.type === 'group' && parent.items.length <= 1) {
    return path.length === 1 ? 'A circuit needs at least one part' : `The only entry of ${groupName(tree, path.slice(0, -1))}: remove the group instead`;
  }
  return null;
}

export function removeNode(tree: CircuitTree, path: NodePath): CircuitTree {
  if (whyNotRemove(tree, path) !== null) return tree;
  return withRoot(tree, replaceAt(tree.root, path, () => undefined));
}

/** A node moved one place up (-1) or down (+1) in its group; the tree unchanged at either end. */
export function moveNode(tree: CircuitTree, path: NodePath, step: -1 | 1): { tree: CircuitTree; path: NodePath } {
  if (path.length === 0) return { tree, path };
  const parentPath = path.slice(0, -1);
  const parent = nodeAt(tree, parentPath);
  const i = path[path.length - 1]!;
  const j = i + step;
  if (parent?.type !== 'group' || j < 0 || j >= parent.items.length) return { tree, path };
  const root = replaceAt(tree.root, parentPath, (n) => {
    const items = [...(n as GroupNode).items];
    [items[i], items[j]] = [items[j]!, items[i]!];
    return { ...(n as GroupNode), items };
  });
  return { tree: withRoot(tree, root), path: [...parentPath, j] };
}

/** A group's connection changed (series ↔ parallel); its parts stay. */
export function setJoin(tree: CircuitTree, path: NodePath, join: Join): CircuitTree {
  return withRoot(tree, replaceAt(tree.root, path, (n) => (n.type === 'group' ? { ...n, join } : n)));
}

/** A part's kind changed: it takes the new kind's starting value (a value in ohms means nothing in henries). */
export function setKind(tree: CircuitTree, path: NodePath, kind: PartKind): CircuitTree {
  return withRoot(tree, replaceAt(tree.root, path, (n) => (n.type === 'part' ? { type: 'part', kind, value: DEFAULT_VALUE[kind] } : n)));
}

// ---------- values in the user's number format ----------

/** SI prefixes for showing a bare number (SI Brochure, 9th ed., Table 7). */
const SHOW_PREFIXES: readonly [number, string][] = [
  [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'], [1e-15, 'f'],
];

/** The engine's own number syntax at the start of a stored text (core/physics/si-prefix.ts). */
const STORED_NUMBER = /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)/u;

/**
 * A stored value as the text of its input, in the user's number format: text keeps its prefix and
 * unit ("4.7 mH" → "4,7 mH" in de-DE); a bare number in Ω, H or F gets a prefix ("0.0047" → "4,7 mH").
 */
export function valueForInput(stored: unknown, kind: PartKind, locale?: string): string {
  const unit = partUnit(kind);
  if (typeof stored === 'number') {
    if (!Number.isFinite(stored)) return '';
    const a = Math.abs(stored);
    const step = a === 0 ? undefined : SHOW_PREFIXES.find(([f]) => a >= f * (1 - 1e-12));
    const [factor, prefix] = step ?? [1, ''];
    return `${formatForInput(stored / factor, locale)} ${prefix}${unit}`;
  }
  if (typeof stored !== 'string') return '';
  // Only the number changes: the prefix, the unit and the spacing stay as written ("10k", "4.7 mH").
  const m = STORED_NUMBER.exec(stored);
  if (!m) return stored;
  const n = Number(m[1]);
  return Number.isFinite(n) ? `${formatForInput(n, locale)}${stored.slice(stored.indexOf(m[1]!) + m[1]!.length)}` : stored;
}

/** An example value in the user's number format. */
export function exampleValue(kind: PartKind, locale?: string): string {
  const d = localeSeparators(locale).decimal;
  return kind === 'resistor' ? `1${d}2 kΩ` : kind === 'inductor' ? `4${d}7 mH` : '220 µF';
}

export type ReadValue = { ok: true; value: ComponentValue } | { ok: false; problem: string };

/**
 * What the user typed, read as a value the engine takes: the number in their number format, the
 * prefix and unit as written ("4,7 mH" in de-DE → "4.7 mH"; "1.000 Ω" → "1000 Ω"; "10" → 10).
 * Only the number is read here; the engine judges the prefix, the unit and the range (setField).
 */
export function readPartValue(text: string, kind: PartKind, locale?: string): ReadValue {
  const typed = text.trim();
  if (typed === '') return { ok: false, problem: `is empty: enter a value, e.g. ${exampleValue(kind, locale)}` };
  const { decimal, group } = localeSeparators(locale);
  const spaces = ' \u00a0\u202f\u2009';
  const chars = `${decimal}${group && spaces.includes(group) ? spaces : group}`.replace(/[\\\]^-]/g, '\\$&');
  const m = new RegExp(`^([+\\-\u2212]?[0-9${chars}]*[0-9](?:[eE][+\\-]?[0-9]+)?)(.*)$`, 'su').exec(typed);
  if (!m) return { ok: false, problem: `"${typed}" does not start with a number: write e.g. ${exampleValue(kind, locale)}` };
  const read = parseLocaleNumber(m[1]!, locale);
  if (read.kind !== 'number') return { ok: false, problem: `"${m[1]!.trim()}" ${read.kind === 'invalid' ? read.problem : 'is not a number'}` };
  const rest = m[2]!.trim();
  return { ok: true, value: rest === '' ? read.value : `${String(read.value)} ${rest}` };
}

/**
 * The engine's message about a value, in the user's terms: it quotes the value as the engine read it
 * ("4.7 mQ"); the user sees what they typed ("4,7 mQ"), and its examples in their number format.
 */
export function valueMessage(message: string, stored: ComponentValue, typed: string, locale?: string): string {
  let out = typeof stored === 'string' ? message.split(`"${stored}"`).join(`"${typed.trim()}"`) : message;
  const d = localeSeparators(locale).decimal;
  if (d !== '.') out = out.replace(/"(\d+)\.(\d+)(\s?[a-zA-ZµΩ]*)"/g, `"$1${d}$2$3"`);
  return out;
}

// ---------- the circuit's figures, as the form shows them ----------

/** What core/physics/network.ts reports of a solved network load (the fields the form reads). */
export interface CircuitFigures {
  frequency: number;
  impedance: { r: number; x: number; magnitude: number };
  p: number;
  powerFactor: number;
  pfSense: 'lagging' | 'leading' | 'unity';
}

/** The figures in words: "12 + j20.76 Ω", "|Z| = 23.98 Ω", the power factor and the power drawn. */
export function figureWords(f: CircuitFigures, locale?: string): { frequency: string; z: string; magnitude: string; pf: string; power: string; open: boolean } {
  const { r, x, magnitude } = f.impedance;
  const frequency = `${formatSignificant(f.frequency, 4, locale)}${UNIT_GAP}Hz`;
  if (!Number.isFinite(magnitude)) return { frequency, z: '—', magnitude: '—', pf: '—', power: formatWithPrefix(f.p, 'W', 4, locale), open: true };
  // One prefix for R and X, chosen by |Z| (the same steps as every figure on the page).
  const [factor, prefix] = magnitude >= 1e6 ? [1e6, 'M'] : magnitude >= 1e3 ? [1e3, 'k'] : [1, ''];
  const sign = x < 0 ? '−' : '+';
  return {
    frequency,
    z: `${formatSignificant(r / factor, 4, locale)} ${sign} j${formatSignificant(Math.abs(x) / factor, 4, locale)}${UNIT_GAP}${prefix}Ω`,
    magnitude: formatWithPrefix(magnitude, 'Ω', 4, locale),
    pf: formatPowerFactor(f.powerFactor, f.pfSense, locale),
    power: formatWithPrefix(f.p, 'W', 4, locale),
    open: false,
  };
}
