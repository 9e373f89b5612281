/**
 * The chain editor's tree as the cards show it: the order of the cards (branches stacked), the loose ones,
 * each card's parent and children, and the card an arrow key reaches.
 */
import { childrenOf, rootOf, type DraftProject } from '../../state/editor.ts';

interface Layout {
  /** Elements reached from the source, in display order (depth first). */
  order: string[];
  /** Elements not reached from the source (a broken `from`, a loop, a second source). */
  loose: string[];
  parent: Map<string, string | undefined>;
  children: Map<string, string[]>;
}

export function layoutOf(p: DraftProject): Layout {
  const children = new Map<string, string[]>();
  const parent = new Map<string, string | undefined>();
  const order: string[] = [];
  const seen = new Set<string>();
  const walk = (id: string, from: string | undefined) => {
    if (seen.has(id)) return;
    seen.add(id);
    order.push(id);
    parent.set(id, from);
    const kids = childrenOf(p, id).map((c) => c.id).filter((c) => !seen.has(c));
    children.set(id, kids);
    for (const k of kids) walk(k, id);
  };
  const root = rootOf(p);
  if (root) walk(root.id, undefined);
  const loose = p.elements.map((e) => e.id).filter((id) => !seen.has(id));
  for (const id of loose) {
    parent.set(id, undefined);
    children.set(id, []);
  }
  return { order, loose, parent, children };
}

/** The card reached from `id` by an arrow key, or undefined. */
export function neighbour(layout: Layout, id: string, key: string): string | undefined {
  const all = [...layout.order, ...layout.loose];
  if (key === 'Home') return all[0];
  if (key === 'End') return all.at(-1);
  if (layout.loose.includes(id)) {
    const i = layout.loose.indexOf(id);
    if (key === 'ArrowLeft' || key === 'ArrowUp') return layout.loose[i - 1] ?? layout.order.at(-1);
    if (key === 'ArrowRight' || key === 'ArrowDown') return layout.loose[i + 1];
    return undefined;
  }
  if (key === 'ArrowLeft') return layout.parent.get(id);
  if (key === 'ArrowRight') return layout.children.get(id)?.[0];
  if (key === 'ArrowUp' || key === 'ArrowDown') {
    const step = key === 'ArrowUp' ? -1 : 1;
    // The nearest sibling branch in that direction, of this card or of the first ancestor that has one.
    for (let at: string | undefined = id; at !== undefined; at = layout.parent.get(at)) {
      const feeder = layout.parent.get(at);
      if (feeder === undefined) break;
      const siblings = layout.children.get(feeder) ?? [];
      const next = siblings[siblings.indexOf(at) + step];
      if (next !== undefined) return next;
    }
    if (step === 1 && layout.loose.length) return layout.loose[0];
  }
  return undefined;
}
