/**
 * The quick variants (issue 20 point 1): the usual comparisons, one function each, each returning a
 * `ProjectVariant` (core/model/variants.ts) to store with the project, or the problems that say why
 * it does not apply to this chain. They only describe the change; solving it is
 * core/solve/project-variant.ts's, comparing it core/studies/variants/.
 */
import type { Problem } from '../model/errors.ts';
import type { ProjectVariant } from '../model/variants.ts';

export type QuickVariantOutcome = { ok: true; variant: ProjectVariant } | { ok: false; problems: Problem[] };
