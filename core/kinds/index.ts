/** The registry of element kinds. To add a kind: write its file beside these and list it here. */
import type { Element, ElementKind } from '../model/project.ts';
import type { KindSpec } from './spec.ts';
import { batteryKind } from './battery.ts';
import { cableKind } from './cable.ts';
import { dcbusKind } from './dc-bus.ts';
import { dcdcKind } from './dc-dc.ts';
import { driveKind } from './drive.ts';
import { genericKind } from './generic.ts';
import { generatorKind, gridKind } from './grid.ts';
import { inverterKind } from './inverter.ts';
import { acCurrentLoadKind, acLoadKind, acVaLoadKind, dcCurrentLoadKind, dcLoadKind, shaftLoadKind } from './loads.ts';
import { motorKind } from './motor.ts';
import { networkLoadKind } from './network-load.ts';
import { pumpKind } from './pump.ts';
import { rectifierKind } from './rectifier.ts';
import { transformerKind } from './transformer.ts';

const all = [
  gridKind,
  generatorKind,
  batteryKind,
  rectifierKind,
  dcdcKind,
  dcbusKind,
  inverterKind,
  transformerKind,
  driveKind,
  motorKind,
  cableKind,
  genericKind,
  dcLoadKind,
  acLoadKind,
  acVaLoadKind,
  dcCurrentLoadKind,
  acCurrentLoadKind,
  shaftLoadKind,
  networkLoadKind,
  pumpKind,
] as const;

/** Every kind by its name. */
export const KINDS: ReadonlyMap<ElementKind, KindSpec> = new Map(all.map((k) => [k.kind, k as unknown as KindSpec<Element>]));

export type { KindSpec, ElementModel, PortInfo } from './spec.ts';
