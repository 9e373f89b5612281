/**
 * The engine as the page's main thread uses it (re-exports only; design in DEVELOPERS.md, "Entry points").
 *
 * web/ and service-worker/ import the engine through this file and `core/studies/index.ts` only
 * (tests/tools/entry-points.test.ts). This one holds what the first screen, the editor, the forms,
 * the templates and storage need: the file format's types, validation and the solve, migration of
 * older files, the words of problems, the demos, the kind registry and the tables the forms offer.
 * Studies are not here: they load on demand through `core/studies/index.ts`. `core/index.ts` stays
 * the whole engine for the command line and library users; the page never imports it.
 */
export type * from './model/project.ts';
export type * from './model/result.ts';
export { PROJECT_LEVEL, type Problem } from './model/errors.ts';
export { PROJECT_VERSION, migrateProject } from './model/migrate.ts';
export { solveProject, validateProject, type SolveOutcome, type Solved, type ValidProject } from './solve/index.ts';
export { elementNames, fieldWords, nonFiniteProblems } from './solve/finite.ts';
export { FIELD_LABELS, KIND_LABELS, elementWords, fieldLabel, kindLabel, pathWords } from './model/field-labels.ts';
export { fillTemplate, type MessageUnit, type MessageValue } from './model/message.ts';
export { issueMessage } from './solve/issue-messages.ts';
export { demoProjects, type DemoProject } from './demos/index.ts';
export { KINDS, studiesOf, type NominalPort } from './kinds/index.ts';
export { driveRatedPower } from './kinds/drive.ts';
export { WATTS_PER_HP } from './data/nema-mg1-12-12.ts';
export { CHEMISTRIES, CHEMISTRY_PRESETS, type Chemistry, type ChemistryValues } from './data/battery-chemistries.ts';
export { CODE_LETTERS } from './data/motor-code-letters.ts';
export { MOTOR_CLASSES } from './physics/motor-rating.ts';
export { bankValues, checkBank } from './physics/bank.ts';
export { pumpShaftPower } from './physics/pump-fan.ts';
export { describeNetworkLoads, type NetworkLoadFigures } from './physics/network.ts';
export { fanAsPumpCurve } from './physics/fan.ts';
export { defaultCatalogue } from './conductors/catalogue.ts';
export { resolveLimits } from './conductors/path-drop.ts';
export { CAUTION as CONDUCTOR_CAUTION } from './conductors/size.ts';
export { DESIGN_BASIS_WORDS, GOVERNING_WORDS, solveAnswers, type BankAnswer, type CableAnswer, type ConverterAnswer, type LossSplit, type SolveAnswers, type WarningAnswer, type WorkingPanel } from './solve/answers.ts';
export { dayNightTariff, meanPrice, tariffOfRunning, type DayNightTariff } from './model/tariff.ts';
