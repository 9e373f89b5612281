/** Joulepath engine: the public API (re-exports only). */
export type * from './model.ts';
export type * from './result.ts';
export { ProjectError, formatProblem, type Problem, type ProblemCode } from './errors.ts';
export { solveProject, solve, validateProject, type SolveOutcome } from './solve/index.ts';
export { demoProjects, type DemoProject } from './demos/index.ts';
export { fitLossPolynomial, prepareLoss, weightedEfficiency, efficiencyAt } from './stages/loss-model.ts';
export { receivingVoltage } from './ac/two-bus.ts';
export { KINDS } from './stages/index.ts';
