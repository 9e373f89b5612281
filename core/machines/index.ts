/** Motors, drives and driven machines: the public entry of core/machines (re-exports only). */
export { compareFlowControl, STANDARD_GRAVITY, HOURS_PER_YEAR, type FlowStudyInput, type FlowControlResult, type FlowControlOutcome, type DutyPointResult, type MethodEnergy, type SpeedControlPoint, type FixedSpeedPoint } from './flow-control.ts';
export { driveLossGrid, driveLossAt, driveLossAtPoint, checkOperatingPoint, truePowerFactor, type DriveLossGrid, type DriveLossAt } from './drive-loss.ts';
export { classEfficiency, motorRating, ratedAt, partLoadRatios, necFullLoadCurrent, typicalPowerFactor, MOTOR_CLASSES, type MotorRating, type FullLoadEfficiency } from './motor-rating.ts';
export { machineDetails, solveWithMachines, NEC_TABLE_CURRENT_NOTE, type MachineDetails, type MotorDetail, type DriveDetail, type MachineSolveOutcome } from './details.ts';
export { formatMachines, formatFlowStudy, MACHINE_CAUTION } from './text-report.ts';
export { projectFlowStudy, pumpDetails, flowStudySchema, type PumpDetail, type ProjectFlowOutcome } from './project-flow.ts';
export { affinitySpeed, pumpCurveHead, systemCurveHead, hydraulicPower, pumpShaftPower } from './flow-control.ts';
