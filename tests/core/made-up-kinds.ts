// Made-up kinds for the tests of the kind registry (tests/core/kind-traits.test.ts,
// tests/web/templates.test.ts): they exist only here, are defined through the same `defineKind`
// API as the kinds of core/kinds/, and reach the engine through the registry's test hook
// `registerKind`. Their figures (set point, efficiency, power) are their own definition, not data
// from any source.
import { z } from 'zod/mini';
import { c } from '../../core/physics/complex.ts';
import { constantPowerLoad, defineKind, efficiencyField, finiteOrNone, fromField, idField, nameField, nominalPort, regulatingConverter } from '../../core/kinds/spec.ts';
import { ranged } from '../../core/kinds/ranges.ts';
import { registerKind } from '../../core/kinds/index.ts';

/** A made-up regulating stage: any electrical input, DC out at its set point, a constant efficiency. */
export interface TestRegulator<K extends string = 'test-regulator'> {
  id: string;
  name?: string;
  kind: K;
  from: string;
  outputVoltage: number;
  efficiency: number;
}

/** The made-up regulator under the name `kind`; `regulates: false` leaves its `regulatesVoltage` trait out (same model). */
export const madeUpRegulator = <K extends string>(kind: K, regulates = true) =>
  defineKind<TestRegulator<K>>({
    kind,
    role: 'stage',
    accepts: () => ['dc', 'ac1', 'ac3'],
    schema: z.strictObject({
      id: idField,
      name: nameField,
      kind: z.literal(kind),
      from: fromField,
      outputVoltage: ranged('voltage'),
      efficiency: efficiencyField(),
    }) as unknown as z.ZodMiniType<TestRegulator<K>>,
    build: (e, input) => regulatingConverter({ out: { kind: 'dc' }, outputVoltage: e.outputVoltage, inputKind: input!.kind, loss: { model: 'constant', efficiency: e.efficiency } }),
    ...(regulates ? { regulatesVoltage: true } : {}),
    nominalOutput: (e) => nominalPort('dc', finiteOrNone(e.outputVoltage)),
  });

export const testRegulatorKind = madeUpRegulator('test-regulator');

/** A made-up DC load: a constant power, set by a load profile through its `power` field. */
export interface TestHeater {
  id: string;
  name?: string;
  kind: 'test-heater';
  from: string;
  power: number;
}

export const testHeaterKind = defineKind<TestHeater>({
  kind: 'test-heater',
  role: 'load',
  accepts: () => ['dc'],
  schema: z.strictObject({ id: idField, name: nameField, kind: z.literal('test-heater'), from: fromField, power: ranged('power', 'non-negative') }) as z.ZodMiniType<TestHeater>,
  build: (e) => constantPowerLoad(c(e.power)),
  load: { field: 'power', unit: 'W' },
});

/** Register the made-up kinds; the returned function takes them out again. */
export function registerMadeUpKinds(): () => void {
  const off = [registerKind(testRegulatorKind), registerKind(testHeaterKind)];
  return () => off.forEach((f) => f());
}
