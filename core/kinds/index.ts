/**
 * The registry of element kinds. To add a kind: write its file beside these (its schema, model and
 * traits, `defineKind` in spec.ts) and list it here. Everything else in the engine and the page
 * reads the kind's facts from here: its role, the ports it accepts, whether it regulates its
 * output voltage or passes it on, its load quantity, its nominal output port, its studies.
 */
import type { Element, ElementKind } from '../model/project.ts';
import type { KindElement, KindSpec, KindStudy } from './spec.ts';
import { batteryKind } from './battery.ts';
import { cableKind } from './cable.ts';
import { dcBusKind } from './dc-bus.ts';
import { dcDcKind } from './dc-dc.ts';
import { driveKind } from './drive.ts';
import { genericKind } from './generic.ts';
import { generatorKind, gridKind } from './grid.ts';
import { inverterKind } from './inverter.ts';
import { acCurrentLoadKind, acLoadKind, acVaLoadKind, dcCurrentLoadKind, dcLoadKind, shaftLoadKind } from './loads.ts';
import { motorKind } from './motor.ts';
import { networkLoadKind } from './network-load.ts';
import { pumpKind } from './pump.ts';
import { fanKind } from './fan.ts';
import { rectifierKind } from './rectifier.ts';
import { transformerKind } from './transformer.ts';
import { transferSwitchKind } from './transfer-switch.ts';

const all = [
  gridKind,
  generatorKind,
  batteryKind,
  rectifierKind,
  dcDcKind,
  dcBusKind,
  inverterKind,
  transformerKind,
  driveKind,
  motorKind,
  cableKind,
  genericKind,
  transferSwitchKind,
  dcLoadKind,
  acLoadKind,
  acVaLoadKind,
  dcCurrentLoadKind,
  acCurrentLoadKind,
  shaftLoadKind,
  networkLoadKind,
  pumpKind,
  fanKind,
] as const;

const registry = new Map<ElementKind, KindSpec>(all.map((k) => [k.kind, k as unknown as KindSpec<Element>]));

/** Every kind by its name. */
export const KINDS: ReadonlyMap<ElementKind, KindSpec> = registry;

/**
 * Test hook: add a kind to the registry (a made-up kind in a test, defined with `defineKind` like
 * the kinds above) until the returned function is called. The engine then validates, plans,
 * solves and sizes elements of that kind as it does the listed ones, reading its traits from its
 * spec alone. Not for the app: its kinds are the ones listed above (the file format names them).
 */
export function registerKind<E extends KindElement>(spec: KindSpec<E>): () => void {
  const kind = spec.kind as ElementKind;
  if (registry.has(kind)) throw new Error(`the kind "${spec.kind}" is already registered`);
  registry.set(kind, spec as unknown as KindSpec);
  return () => {
    registry.delete(kind);
  };
}

/** The spec of a kind, or undefined for a name the registry does not know. */
export const kindSpec = (kind: string): KindSpec | undefined => registry.get(kind as ElementKind);

/** Does this kind hold its output voltage at its set point (the `regulatesVoltage` trait)? */
export const regulatesVoltage = (kind: string): boolean => registry.get(kind as ElementKind)?.regulatesVoltage === true;

/** Does this kind carry its input on without converting it (the `passive` trait)? */
export const isPassive = (kind: string): boolean => registry.get(kind as ElementKind)?.passive === true;

/** The studies the elements of a project may take part in, from their kinds' `studies` traits. */
export function studiesOf(elements: readonly { kind: string }[]): Set<KindStudy> {
  const out = new Set<KindStudy>();
  for (const e of elements) for (const s of registry.get(e.kind as ElementKind)?.studies ?? []) out.add(s);
  return out;
}

export type { KindSpec, KindStudy, ElementModel, LoadQuantity, NominalPort, PortInfo } from './spec.ts';
