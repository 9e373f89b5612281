/**
 * The studies as the page loads them on demand (re-exports only; design in DEVELOPERS.md, "Entry points").
 *
 * The study panels, the energy-flow diagram, the client report and the panel worker import studies
 * through this file; nothing the first screen loads statically may (tests/tools/entry-points.test.ts),
 * so study code stays in lazy chunks. The rest of the engine the page needs is in `core/page.ts`.
 */
export { flowGraph, type FlowGraph, type FlowLink, type FlowNode } from './energy-flow.ts';
export { runBackupStudy, type BackupStudyResult } from './backup/study.ts';
export { runModesStudy, type ModesStudyResult } from './modes/study.ts';
export { spreadPlan, spreadRun, spreadSensitivity, spreadSummary, DEFAULT_SPREAD_SAMPLES, DEFAULT_SPREAD_SEED, INPUT_WORDS, SPREAD_INPUTS, TOLERANCE_FIELD, TYPICAL_TOLERANCES, TYPICAL_WHY, type SampleFigures, type SpreadChunk, type SpreadInput, type SpreadPlan, type SpreadResult, type Swing, type Percentiles, type HistogramBin } from './spread/index.ts';
export { solveModes, type Modes } from '../solve/modes.ts';
export type { PassThroughWorking } from './modes/study.ts';
export type { SwitchTransfer } from './modes/switches.ts';
export type { CableAcrossModes, CableCase } from './modes/cables.ts';
export type { Derate } from './backup/discharge.ts';
export { bankCautions, rechargeCautions } from './backup/cautions.ts';
export { backupSettingsProblems, profileDay, profileLoadList, profileStartHour, type DayInterval, type ProfileLoadInfo, type ProfileDay, type ProfileDayOutcome } from './backup/profile-day.ts';
export { machineDetails, type DriveDetail, type MotorDetail } from './machines/details.ts';
export { projectPumpDuty, pumpDetails, type PumpDetail } from './machines/pump-duty.ts';
export { fanDetails, type FanDetail } from './machines/pump-duty.ts';
export type { PumpControlResult } from '../physics/pump-fan.ts';
export { curveFromPoints, dutyCurves, dutyFlowAtSpeed, dutySpeedAtFlow, type CurveFromPoints, type DutyCurves } from './machines/duty-curves.ts';
export { DEFAULT_TARGET_POWER_FACTOR, pfCorrectionCandidates } from './pf/placement.ts';
export { correctPowerFactor, type PfCorrection } from './pf/correction.ts';
export { lossCostPerYear, pumpDutyCosts, type CostSettings, type LossCost, type MethodCosts } from './economics.ts';
export { lossCostOfSolved, lossCostOverProfile, LOSS_OVER_PROFILE_METHOD } from './loss-over-profile.ts';
export { withProfilePrice } from './economics.ts';
export { lifetimeCost, lifetimeSettingsOf, compareLifetime, compareSolved, breakEven, typicalFuelFigures, TYPICAL_FUEL_NOTE, type LifetimeCost, type LifetimeOutcome, type LifetimeSettings, type BreakEven, type CostStream } from './lifetime.ts';
export { searchOptions, listedSizes, SEARCH_CAUTION, type SearchResult, type SearchOutcome, type EvaluatedOption, type MetOption, type RejectedGroup } from './search/index.ts';
export { GENERATOR_RATED_POWER_FACTOR, dutyHoursPerYear } from './lifetime.ts';
export { projectLifetimeCost, projectRechargeRun, rechargeRunOf } from './lifetime-recharge.ts';
export { studySurges, type DeviceCheck, type FaultPoint, type MotorStartResult, type StartCheck } from './surge/index.ts';
export { answerStudies, studyAnswersFrom, type BankStudyAnswer, type CostAnswer, type StartAnswer, type StudyAnswers } from './answers.ts';
export { compareVariants, compareColumns, solveColumns, type ColumnSolve, type ComparisonColumn, type ComparisonRow, type RowGroup, type RowQuantity, type VariantComparison } from './variants/compare.ts';
export { changedFields, mergeSet, criticalLoadsVariant, nextSizeUpVariant, systemBank, systemVoltageVariant, SYSTEM_VOLTAGES, type QuickVariantOutcome } from '../variants/index.ts';
