/** The option search: re-exports only (README.md here). */
export { SEARCH_AXES, listedSizes, voltageChoices, type VoltageChoice, type SearchAxisDef, type SearchChoice, type SearchDimension } from './axes.ts';
export { bankForTarget, durationWords, evaluateOption, runtimeOf, optionName, variantOf, type EvaluatedOption, type SearchReason, type SearchTarget } from './evaluate.ts';
export { dominates, paretoFront, type Costed } from './pareto.ts';
export { SEARCH_CAUTION, groupReasons, searchDimensions, searchGroups, searchOptions, searchTarget, type SearchGroup, type MetOption, type RejectedGroup, type SearchOutcome, type SearchResult, type SearchRun } from './search.ts';
export { TEXT_REJECTED_MAX, formatSearch, rejectedLine } from './text.ts';
