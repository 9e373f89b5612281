/** Words shown for the engine's element and port kinds (display only). */
import { KIND_LABELS, type ElementKind, type PortKind } from '../../core/page.ts';

/** The kinds' trade names: one table, in core (core/model/field-labels.ts), which the engine's messages use too. */
const ELEMENT_KIND_LABELS: Readonly<Record<ElementKind, string>> = KIND_LABELS;

const PORT_KIND_LABELS: Record<PortKind, string> = {
  dc: 'DC',
  ac1: 'AC 1φ',
  ac3: 'AC 3φ',
  shaft: 'Shaft',
};

/** The trade name of an element kind; unknown kinds are shown as given. */
export function elementKindLabel(kind: string): string {
  return (ELEMENT_KIND_LABELS as Record<string, string>)[kind] ?? kind;
}

export function portKindLabel(kind: string): string {
  return (PORT_KIND_LABELS as Record<string, string>)[kind] ?? kind;
}

/**
 * A project name as a file-name stem: accents dropped, lower case, letters and digits joined by
 * single dashes, at most 60 characters ('' when nothing is left).
 */
export function fileNameStem(name: string): string {
  return name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
}
