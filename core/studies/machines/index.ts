/** Motors, drives and driven machines: the public entry of core/studies/machines (re-exports only). */
export { comparePumpControl, STANDARD_GRAVITY, HOURS_PER_YEAR, type PumpDutyInput, type PumpControlResult, type PumpControlOutcome, type DutyPointResult, type MethodEnergy, type SpeedControlPoint, type FixedSpeedPoint } from '../../physics/pump-fan.ts';
export { driveLossGrid, driveLossAt, driveLossAtPoint, checkOperatingPoint, truePowerFactor, type DriveLossGrid, type DriveLossAt } from '../../physics/drive-loss.ts';
export { classEfficiency, motorRating, ratedAt, partLoadRatios, necFullLoadCurrent, typicalPowerFactor, MOTOR_CLASSES, type MotorRating, type FullLoadEfficiency } from '../../physics/motor-rating.ts';
export { machineDetails, solveWithMachines, NEC_TABLE_CURRENT_NOTE, type MachineDetails, type MotorDetail, type DriveDetail, type MachineSolveOutcome } from './details.ts';
export { formatMachines, formatPumpDuty, MACHINE_CAUTION } from './text-report.ts';
export { projectPumpDuty, pumpDetails, fanDetails, pumpDutySchema, type PumpDetail, type FanDetail, type PumpDutyOutcome } from './pump-duty.ts';
export { affinitySpeed, pumpCurveHead, systemCurveHead, hydraulicPower, pumpShaftPower } from '../../physics/pump-fan.ts';
export { curveFromPoints, dutyCurves, dutyFlowAtSpeed, dutySpeedAtFlow, type FlowAtSpeed, type CurveFromPoints, type DutyCurves, type CurveRow } from './duty-curves.ts';
export { fitFallingQuadratic, curveAt, CURVE_FIT_METHOD, type CurveFit, type CurvePoint } from '../../physics/curve-fit.ts';
export { fanOperatingPoint, fanAsPumpCurve, STANDARD_AIR_DENSITY, type FanOperatingPoint } from '../../physics/fan.ts';
