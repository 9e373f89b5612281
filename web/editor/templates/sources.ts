/**
 * The sources a new project can start from, and the bank on a bus a DC bus card offers (issue 19).
 * Demo defaults, common practice (no source). Part of the templates; web/editor/templates.ts is their entry.
 */
import { type ElementKind, KINDS } from '../../../core/page.ts';
import type { DraftElement, DraftProject } from '../../state/editor.ts';
import { nominalPorts } from './ports.ts';

/** A source kind fed from a bus (the engine's `fedRole` trait): a bank on a bus. */
export const isBankOnBus = (e: DraftElement): boolean => e.from !== undefined && KINDS.get(e.kind as ElementKind)?.fedRole !== undefined;

/** A source a new project can start from. */
export interface SourceTemplate {
  key: string;
  label: string;
  element: DraftElement;
}

/** Sources for a new project (demo defaults, common practice (no source)). */
export const SOURCE_TEMPLATES: readonly SourceTemplate[] = [
  { key: 'grid-3-400', label: 'Utility supply, 3φ 400 V 50 Hz', element: { id: 'supply', name: '400 V supply', kind: 'grid', phases: 3, voltage: 400, frequency: 50 } },
  { key: 'grid-1-230', label: 'Utility supply, 1φ 230 V 50 Hz', element: { id: 'supply', name: '230 V supply', kind: 'grid', phases: 1, voltage: 230, frequency: 50 } },
  {
    key: 'grid-1-240-60',
    // Split-phase 120/240 V is modelled across the two lines (240 V); 120 V loads go behind a transformer or as their share.
    label: 'Utility supply, 1φ 120/240 V 60 Hz',
    element: { id: 'supply', name: '120/240 V service', kind: 'grid', phases: 1, voltage: 240, frequency: 60 },
  },
  { key: 'grid-3-480-60', label: 'Utility supply, 3φ 480 V 60 Hz', element: { id: 'supply', name: '480 V service', kind: 'grid', phases: 3, voltage: 480, frequency: 60 } },
  {
    key: 'generator',
    label: 'Generator, 3φ 400 V 50 Hz, 20 kVA',
    element: { id: 'generator', name: '20 kVA generator', kind: 'generator', phases: 3, voltage: 400, frequency: 50, resistance: 0.05, reactance: 0.4, ratedApparentPower: 20000 },
  },
  {
    key: 'battery-48',
    label: 'Battery bank, 48 V LiFePO4 (16 × 100 Ah)',
    element: { id: 'bank', name: '48 V LiFePO4 bank', kind: 'battery', bank: { chemistry: 'lifepo4', series: 16, strings: 1, capacityAh: 100 } },
  },
];

/**
 * A bank on a bus (issue 19): offered on a DC bus card of a chain fed from a supply, while the project
 * holds no bank on a bus yet (a project holds one, core/solve/structure.ts). The preset: VRLA AGM 12 V
 * 100 Ah blocks (6 cells each), as many in series as make the bus's voltage the float voltage, at
 * 2.27 V per cell (VRLA float, 2.25–2.30 V per cell at 25 °C: common practice (no source); the maker's
 * figure governs); one string. Null when the card is no DC bus, the bus's voltage is unknown, or a bank
 * already sits on a bus.
 */
export function bankOnBusTemplate(project: DraftProject, busId: string): DraftElement | null {
  const bus = project.elements.find((e) => e.id === busId);
  if (!bus || bus.kind !== 'dc-bus') return null;
  const root = project.elements.find((e) => e.from === undefined);
  if (!root || root.kind === 'battery') return null;
  if (project.elements.some((e) => isBankOnBus(e))) return null;
  const v = nominalPorts(project).get(busId)?.voltage;
  if (v === undefined || !(v > 0)) return null;
  const series = Math.max(1, Math.round(v / (6 * 2.27)));
  return {
    id: 'bank',
    name: `Battery bank, ${series} × 12 V 100 Ah`,
    kind: 'battery',
    bank: { chemistry: 'vrla-agm', series, cellsPerBlock: 6, strings: 1, capacityAh: 100 },
  };
}
