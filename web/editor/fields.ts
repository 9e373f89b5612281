/**
 * What the stage form shows for each element kind: its fields (path, label in the trade's words,
 * physical quantity, required or optional, choices, one line of help) and the choice groups where
 * one of several ways of describing the element is picked (loss model, drive losses, motor
 * efficiency source, cable impedance, battery description).
 *
 * Plain data and small pure functions only: the form components (web/components/fields/) render
 * it, the engine (core/) checks every value written. Defaults are planning examples the user is
 * expected to replace; none of them is a computed engineering figure.
 *
 * This file is the descriptors' entry (re-exports only); they live in web/editor/fields/: `types.ts`,
 * `common.ts` (helpers and fields several kinds share), one file per kind group (`sources.ts`,
 * `converters.ts`, `machines.ts`, `cable.ts`, `loads.ts`), `registry.ts` (every kind's form and what
 * the form code reads from it), `messages.ts` and `project.ts` (the project-level form).
 */
export type {
  FormElement,
  FormContext,
  ChoiceOption,
  NumberSpec,
  ChoiceSpec,
  TextSpec,
  BooleanSpec,
  PointsColumn,
  PointsSpec,
  NetworkSpec,
  Variant,
  GroupSpec,
  FieldSpec,
  KindForm,
} from './fields/types.ts';
export { valueAt } from './fields/common.ts';
export { sizeOptions, methodOptions } from './fields/cable.ts';
export { KIND_FORMS, formFor, allFields, shownFields, defaultElement } from './fields/registry.ts';
export { messageForField } from './fields/messages.ts';
export { DROP_BASES, PROJECT_FIELDS } from './fields/project.ts';
