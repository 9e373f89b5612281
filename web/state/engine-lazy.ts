/**
 * The engine's heavy part, which the page loads on demand (`web/state/engine.ts`): validation, the
 * solve (with conductor sizing and every published table it reads) and the kind registry's study
 * list. Re-exports only; imported with `import()` alone, so none of it is in the first load.
 */
export { solveProject, validateProject, studiesOf } from '../../core/page.ts';
