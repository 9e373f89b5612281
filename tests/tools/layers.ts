/**
 * The engine's layers and the one direction they read in (see DEVELOPERS.md, "Layers"):
 * data → model → physics → element kinds → conductor sizing → solve → studies → command line and
 * public API. A file may import from its own layer and the layers below it, never from one above.
 * Type-only imports count too: a type from above ties a lower layer to a higher one all the same.
 */
import { dirname, join, normalize } from 'node:path';
import { codeOnly } from './core-purity.ts';

/** Each layer, lowest first, with the paths (relative to the repository) that belong to it. */
export const LAYERS: readonly { name: string; paths: readonly string[] }[] = [
  { name: 'data', paths: ['core/data/'] },
  { name: 'model', paths: ['core/model/'] },
  { name: 'physics', paths: ['core/physics/'] },
  { name: 'element kinds', paths: ['core/kinds/'] },
  { name: 'conductor sizing', paths: ['core/conductors/'] },
  { name: 'solve', paths: ['core/solve/'] },
  { name: 'studies', paths: ['core/studies/', 'core/variants/'] },
  { name: 'command line and public API', paths: ['core/cli/', 'core/schema/', 'core/demos/', 'core/index.ts', 'core/page.ts'] },
];

/** The layer's index of a file of core/, or undefined when no layer claims it. */
export function layerOf(file: string): number | undefined {
  const i = LAYERS.findIndex((layer) => layer.paths.some((p) => (p.endsWith('/') ? file.startsWith(p) : file === p)));
  return i < 0 ? undefined : i;
}

export interface LayerViolation {
  file: string;
  line: number;
  imports: string;
  rule: string;
}

/** Every import of one core/ file that reads upward (or from a file no layer claims). */
export function checkLayers(file: string, source: string): LayerViolation[] {
  const own = layerOf(file);
  if (own === undefined) return [{ file, line: 1, imports: '', rule: 'file belongs to no layer' }];
  const found: LayerViolation[] = [];
  for (const { spec, line } of codeOnly(source).specifiers) {
    if (!spec.startsWith('.')) continue; // packages (zod) and Node built-ins sit outside the layers
    const target = normalize(join(dirname(file), spec)).split('\\').join('/');
    if (!target.startsWith('core/')) continue; // web/ is the purity test's business
    const theirs = layerOf(target);
    if (theirs === undefined) found.push({ file, line, imports: target, rule: 'imports a file no layer claims' });
    else if (theirs > own) {
      found.push({ file, line, imports: target, rule: `${LAYERS[own]!.name} imports from ${LAYERS[theirs]!.name}, a higher layer` });
    }
  }
  return found;
}
