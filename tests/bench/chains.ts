/**
 * Large chains for the scale benchmark and the scale tests (invented: no real installation). Every
 * shape is one the import accepts up to its 2000-element limit, and valid at any size:
 * - `deepCables`: grid → cable → cable … → load, one long series run of short cable pieces;
 * - `deepConverters`: battery → DC-DC → DC-DC … → load, a chain of regulating converters;
 * - `wide`: grid → one cable → n − 2 loads side by side on it;
 * - `tree`: grid → a binary tree of cables, a load at every leaf;
 * - `deepSized`: grid → cables whose size the conductor sizing chooses → load;
 * - `comb`: grid → cable → cable … with a load at the far end of every cable (deep and wide at
 *   once; its whole-path drops list every cable above each load, so that part of the result grows
 *   with the square of the depth);
 * - `loop`: a chain whose elements (but the source) feed each other in a ring.
 * `n` is the element count, source and loads included.
 */
import type { Element, Project } from '../../core/index.ts';

const project = (name: string, elements: Element[]): Project => ({ format: 'joulepath-project', version: 2, name, elements });

const grid: Element = { id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50, resistance: 0.001, reactance: 0.003 };

/** 1 m of 0.1 Ω/km cable per piece: 2000 pieces are 0.2 Ω, a few volts at the load below. */
const piece = (id: string, from: string): Element => ({ id, kind: 'cable', from, length: 1, resistancePerKm: 0.1, reactancePerKm: 0.08 });

export function deepCables(n: number): Project {
  const elements: Element[] = [grid];
  let from = 'grid';
  for (let i = 1; i <= n - 2; i++) {
    const id = `c${i}`;
    elements.push(piece(id, from));
    from = id;
  }
  elements.push({ id: 'load', kind: 'ac-load', from, power: 10e3, powerFactor: 0.9 });
  return project(`Deep cable run, ${n} elements`, elements);
}

export function deepConverters(n: number): Project {
  const elements: Element[] = [{ id: 'bank', kind: 'battery', voltage: 48, internalResistance: 0.01 }];
  let from = 'bank';
  for (let i = 1; i <= n - 2; i++) {
    const id = `dcdc${i}`;
    // 99.99 %: 2000 stages in series lose about 18 % of the power, well inside what the bank gives.
    elements.push({ id, kind: 'dc-dc', from, outputVoltage: i % 2 ? 24 : 48, loss: { model: 'constant', efficiency: 0.9999 } });
    from = id;
  }
  elements.push({ id: 'load', kind: 'dc-load', from, power: 100 });
  return project(`Deep converter chain, ${n} elements`, elements);
}

export function wide(n: number): Project {
  const elements: Element[] = [grid, { id: 'main', kind: 'cable', from: 'grid', length: 10, resistancePerKm: 0.05, reactancePerKm: 0.07 }];
  for (let i = 1; i <= n - 2; i++) elements.push({ id: `l${i}`, kind: 'ac-load', from: 'main', power: 20, powerFactor: 0.95 });
  return project(`Wide board, ${n} elements`, elements);
}

/** A binary tree of cables under the grid, in breadth-first file order; leaves carry a load each. */
export function tree(n: number): Project {
  const elements: Element[] = [grid];
  const cables: string[] = [];
  // Cables first (about half the elements), then one load per cable with no cable below it.
  const nCables = Math.floor((n - 1) / 2);
  for (let i = 0; i < nCables; i++) {
    const id = `t${i}`;
    elements.push(piece(id, i === 0 ? 'grid' : `t${Math.floor((i - 1) / 2)}`));
    cables.push(id);
  }
  const hasChild = new Set(cables.slice(1).map((_, i) => `t${Math.floor(i / 2)}`));
  let k = 0;
  for (const id of cables) if (!hasChild.has(id)) elements.push({ id: `tl${k++}`, kind: 'ac-load', from: id, power: 50, powerFactor: 0.9 });
  // Top up to n with loads on the first cable.
  while (elements.length < n) elements.push({ id: `tl${k++}`, kind: 'ac-load', from: 't0', power: 50, powerFactor: 0.9 });
  return project(`Cable tree, ${n} elements`, elements);
}

/** A run of conductors sized by the IEC method, each piece 1 m (the drop limit is per link). */
export function deepSized(n: number): Project {
  const elements: Element[] = [{ id: 'grid', kind: 'grid', phases: 3, voltage: 400, frequency: 50 }];
  let from = 'grid';
  for (let i = 1; i <= n - 2; i++) {
    const id = `s${i}`;
    elements.push({ id, kind: 'cable', from, length: 1, conductor: { system: 'iec', material: 'copper', size: 'auto', insulation: 'pvc', installationMethod: 'C' } } as Element);
    from = id;
  }
  elements.push({ id: 'load', kind: 'ac-load', from, power: 300, powerFactor: 0.9 });
  const p = project(`Deep sized run, ${n} elements`, elements);
  // The whole run is one path: its total drop may pass the whole-path limit (a warning, not a refusal).
  return { ...p, dropLimits: { totalPercent: 100 } };
}

export function comb(n: number): Project {
  const elements: Element[] = [grid];
  let from = 'grid';
  for (let i = 1; elements.length < n; i++) {
    elements.push(piece(`k${i}`, from));
    if (elements.length < n) elements.push({ id: `kl${i}`, kind: 'ac-load', from: `k${i}`, power: 10, powerFactor: 0.9 });
    from = `k${i}`;
  }
  return project(`Comb of ${n} elements`, elements);
}

/** grid → load, plus a ring of n − 2 cables that feed each other (no source reaches them). */
export function loop(n: number): Project {
  const ring = n - 2;
  const elements: Element[] = [grid, { id: 'load', kind: 'ac-load', from: 'grid', power: 100, powerFactor: 1 }];
  for (let i = 0; i < ring; i++) elements.push(piece(`r${i}`, `r${(i + ring - 1) % ring}`));
  return project(`Loop of ${ring} cables`, elements);
}
