/** Joulepath engine: the public API (re-exports only). */
export type * from './model/project.ts';
export type * from './model/result.ts';
export { PROJECT_LEVEL, ProjectError, formatProblem, type Problem, type ProblemCode } from './model/errors.ts';
export { solveProject, solve, validateProject, type SolveOutcome, type Solved, type ValidProject } from './solve/index.ts';
export { solveVariant, variantProject, type VariantChange } from './solve/variant.ts';
export { solveProjectVariant, variantChangeOf, type VariantChangeOutcome } from './solve/project-variant.ts';
export { readSolveCounts, resetSolveCounts, type SolveCounts } from './solve/count.ts';
export { findNonFinite, nonFiniteProblems, elementNames, type NonFiniteFigure } from './solve/finite.ts';
export { demoProjects, type DemoProject } from './demos/index.ts';
export { fitLossPolynomial, prepareLoss, weightedEfficiency, efficiencyAt } from './physics/loss-model.ts';
export { receivingVoltage } from './physics/two-bus.ts';
export { KINDS } from './kinds/index.ts';
export { defaultCatalogue, approximateDrop, resolveLimits, pathDrops, CONDUCTOR_CAUTION, type ConductorCatalogue } from './conductors/index.ts';
export {
  sizeBank,
  worksheetSections,
  peukertCapacityFactor,
  ieee485TemperatureFactor,
  DEFAULT_AGING_FACTOR,
  DEFAULT_DESIGN_MARGIN,
  type SizingInput,
  type SizingOutcome,
  type BankSizing,
  type DutyCycle,
  type WorksheetSection,
  type WorksheetRow,
  type SizingStep,
} from './studies/backup/sizing.ts';
export {
  rechargeTime,
  chargerForTargetTime,
  CHARGE_PROFILES,
  type RechargeInput,
  type ChargerForTimeInput,
  type RechargeOutcome,
  type ChargerOutcome,
  type Recharge,
  type ChargerSizing,
  type ChargeProfile,
} from './studies/backup/recharge.ts';
export { CHEMISTRY_PRESETS, CHEMISTRIES, type Chemistry, type ChemistryPreset, type ChemistryValues } from './data/battery-chemistries.ts';
export { resolveBank, checkBank, ocvAt, bankOcv, capacityFactorAt, type Bank } from './physics/bank.ts';
export { simulateDischarge, dischargeVariant, type DischargeResult, type DischargeOutcome, type DischargeSeries, type Derate, type EndReason, type IdleDraw } from './studies/backup/discharge.ts';
export { runBackupStudy, terminalPowerPeriods, type BackupStudyResult, type BackupStudyOutcome } from './studies/backup/study.ts';
export { formatBackupStudy } from './studies/backup/text-report.ts';
export { backupSettingsProblems, profileDay, type DayInterval, type ProfileDay, type ProfileDayOutcome } from './studies/backup/profile-day.ts';
export { solveModes, bankOnBus, onBatteryChange, rechargeChange, outageSolve, type Modes, type BankPlace } from './solve/modes.ts';
export { runModesStudy, type ModesStudyResult, type ModesStudyOutcome, type ModeFigures, type RectifierSizing, type StandingLosses, type Transfer } from './studies/modes/study.ts';
export { formatModesStudy } from './studies/modes/text-report.ts';
export { runSpread, spreadPlan, spreadRun, spreadSensitivity, spreadSummary, formatSpread, TYPICAL_TOLERANCES, type SpreadResult, type SpreadChunk, type SpreadPlan, type SpreadOptions, type Swing } from './studies/spread/index.ts';
export type { SpreadSettings } from './model/spread.ts';
export { passThroughPlaces, passThroughChange, chargerOf, type PassThroughPlace, type PassThroughMode } from './solve/modes.ts';
export type { PassThroughWorking, ModesStudyOptions } from './studies/modes/study.ts';
export { switchWorking, batteryPathWarnings, type SwitchTransfer } from './studies/modes/switches.ts';
export { cablesAcrossModes, type CableAcrossModes, type CableCase } from './studies/modes/cables.ts';
export { bankCautions, rechargeCautions } from './studies/backup/cautions.ts';
export { parseSiValue, formatSi, type ElementUnit, type ParsedValue } from './physics/si-prefix.ts';
export {
  parseNetwork,
  networkImpedance,
  componentImpedance,
  starEquivalent,
  impedanceFigures,
  describeNetworkLoads,
  type CircuitNetwork,
  type ComponentValue,
  type ParsedNetwork,
  type NetworkConnection,
  type ImpedanceFigures,
  type NetworkLoadFigures,
} from './physics/network.ts';
export {
  correctPowerFactor,
  requiredReactivePower,
  bankCapacitance,
  leadingBelowFraction,
  PF_CORRECTION_CAUTION,
  DEFAULT_LIGHT_LOAD_FRACTION,
  type PfCorrection,
  type PfCorrectionRequest,
  type PfCorrectionOutcome,
  type CapacitorBank,
  type UpstreamChange,
  type InterfaceState,
} from './studies/pf/correction.ts';
export { DEFAULT_TARGET_POWER_FACTOR, pfCorrectionCandidates, type PfCandidate } from './studies/pf/placement.ts';
export { formatNetworkLoads, formatPfCorrection } from './studies/pf/text-report.ts';
export {
  comparePumpControl,
  driveLossGrid,
  driveLossAt,
  driveLossAtPoint,
  truePowerFactor,
  classEfficiency,
  motorRating,
  partLoadRatios,
  necFullLoadCurrent,
  machineDetails,
  solveWithMachines,
  formatMachines,
  formatPumpDuty,
  projectPumpDuty,
  pumpDetails,
  fanDetails,
  type FanDetail,
  type PumpDetail,
  type PumpDutyOutcome,
  MOTOR_CLASSES,
  NEC_TABLE_CURRENT_NOTE,
  type PumpDutyInput,
  type PumpControlResult,
  type PumpControlOutcome,
  type DriveLossGrid,
  type DriveLossAt,
  type MotorRating,
  type MachineDetails,
  type MotorDetail,
  type DriveDetail,
  type MachineSolveOutcome,
  curveFromPoints,
  dutyCurves,
  fitFallingQuadratic,
  fanOperatingPoint,
  type CurveFit,
  type DutyCurves,
} from './studies/machines/index.ts';
export { flowGraph, lossNodeId, lossParts, LOSS_SUFFIX, type FlowGraph, type FlowNode, type FlowLink, type FlowNodeRole, type LossPart, type LossSummary, type Share } from './studies/energy-flow.ts';
export { lossCostPerYear, pumpDutyCosts, energyCost, checkCostSettings, HOURS_IN_YEAR, MAX_HOURS_PER_YEAR, type CostSettings, type LossCost, type LossCostRow, type LossCostOutcome, type MethodCosts } from './studies/economics.ts';
export { dutyHoursPerYear } from './studies/lifetime.ts';
export { profileDayHours } from './model/tariff.ts';
export { lifetimeCost, lifetimeSettingsOf, checkLifetimeSettings, compareLifetime, compareSolved, breakEven, costStream, netPresentValue, presentValue, meanPrice, fuelRate, generatorFuelPerYear, typicalFuelFigures, TYPICAL_FUEL_NOTE, formatLifetimeCost, type LifetimeCost, type LifetimeOutcome, type LifetimeSettings, type BreakEven, type CostStream, type GeneratorYear, type FuelRun, type RechargeRun } from './studies/lifetime.ts';
export { compareVariants, compareColumns, solveColumns, COMPARISON_CAUTIONS, type ColumnSolve, type CompareOptions, type ComparisonColumn, type ComparisonRow, type RowGroup, type RowQuantity, type VariantComparison } from './studies/variants/compare.ts';
export { criticalLoadsVariant, nextSizeUpVariant, seriesForSystem, systemBank, systemVoltageVariant, SYSTEM_VOLTAGES, type QuickVariantOutcome, type SystemVoltage } from './variants/index.ts';
export { searchOptions, searchDimensions, searchTarget, paretoFront, dominates, listedSizes, SEARCH_AXES, SEARCH_CAUTION, type SearchResult, type SearchOutcome, type SearchRun, type EvaluatedOption, type MetOption, type RejectedGroup, type SearchReason } from './studies/search/index.ts';
export { SEARCH_MAX_COMBINATIONS, type OptionSearch } from './model/option-search.ts';
export {
  studySurges,
  hasSurgeInputs,
  formatSurgeStudy,
  startingFigures,
  voltageFactor,
  trapWarnings,
  surgeCautions,
  type SurgeOutcome,
  type SurgeStudyResult,
  type MotorStartResult,
  type StartCheck,
  type StartVerdict,
  type FaultPoint,
  type DeviceCheck,
} from './studies/surge/index.ts';
export { NEC_430_7_B, CODE_LETTERS, type CodeLetter, type CodeLetterRow } from './data/motor-code-letters.ts';
