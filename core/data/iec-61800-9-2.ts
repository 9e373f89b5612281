/**
 * Power drive systems: the eight standard loss-determination operating points, the IE/IES class
 * bands, and class-reference default losses of a complete drive module (CDM).
 *
 * Source: IEC 61800-9-2:2017 (superseded by :2023, which keeps the points and moves the CDM loss
 * model to Annex C). The points and the class bands are from memory except the IES bands
 * (confirmed against the OPC 40400-1 PowerTrain companion specification, clause 7.9.6.2).
 * The CDM points use 90 % relative motor-stator frequency where the PDS (motor + CDM) points use
 * 100 % speed; the torque axis is relative torque-producing current (CDM) or relative torque (PDS).
 *
 * DEFAULT RELATIVE LOSSES: the standard's reference CDM losses are not carried (no published copy
 * found). The defaults below are typical losses of a CDM that meets IE2, in per cent of its rated
 * apparent output power — common practice (no source); give the maker's eight values where known.
 *
 * Units: speed and torque in per cent; losses in per cent of the CDM's rated apparent power.
 */
import type { Provenance } from './conductor-materials.ts';

export type DriveLossBasis = 'cdm' | 'pds';

export interface OperatingPoint {
  /** Relative speed (PDS) or relative motor-stator frequency (CDM), %. */
  readonly speed: number;
  /** Relative torque (PDS) or relative torque-producing current (CDM), %. */
  readonly torque: number;
}

/** The speed grid: 0, 50 and 90 % (CDM) or 100 % (PDS). */
export const SPEED_GRID: Readonly<Record<DriveLossBasis, readonly number[]>> = { cdm: [0, 50, 90], pds: [0, 50, 100] };
/** The torque grid, %. */
export const TORQUE_GRID: readonly number[] = [25, 50, 100];

/** The eight points in the standard's order: (0,25) (0,50) (0,100) (50,25) (50,50) (50,100) (90|100,50) (90|100,100). */
export const STANDARD_POINTS: Readonly<Record<DriveLossBasis, readonly OperatingPoint[]>> = {
  cdm: [
    { speed: 0, torque: 25 },
    { speed: 0, torque: 50 },
    { speed: 0, torque: 100 },
    { speed: 50, torque: 25 },
    { speed: 50, torque: 50 },
    { speed: 50, torque: 100 },
    { speed: 90, torque: 50 },
    { speed: 90, torque: 100 },
  ],
  pds: [
    { speed: 0, torque: 25 },
    { speed: 0, torque: 50 },
    { speed: 0, torque: 100 },
    { speed: 50, torque: 25 },
    { speed: 50, torque: 50 },
    { speed: 50, torque: 100 },
    { speed: 100, torque: 50 },
    { speed: 100, torque: 100 },
  ],
};
export const POINTS_PROVENANCE: Provenance = 'from memory';

/**
 * IE2-class CDM, relative losses at the eight CDM points, % of rated apparent output power, in
 * the order of `STANDARD_POINTS.cdm`. Common practice (no source).
 */
export const IE2_CDM_DEFAULT_LOSS_PERCENT: readonly number[] = [0.9, 1.1, 1.7, 1.0, 1.3, 2.0, 1.5, 2.4];
export const DEFAULT_LOSS_PROVENANCE: Provenance = 'common practice';

/** CDM classes at (90;100) against the reference CDM's losses (from memory). */
export const IE_CDM_BANDS = [
  { class: 'IE0', rule: 'losses more than 25 % above the reference CDM' },
  { class: 'IE1', rule: 'losses within ±25 % of the reference CDM' },
  { class: 'IE2', rule: 'losses more than 25 % below the reference CDM' },
] as const;

/** PDS classes at (100;100) against the reference PDS's losses (confirmed, OPC 40400-1 7.9.6.2). */
export const IES_PDS_BANDS = [
  { class: 'IES0', rule: 'losses more than 20 % above the reference PDS' },
  { class: 'IES1', rule: 'losses within ±20 % of the reference PDS' },
  { class: 'IES2', rule: 'losses more than 20 % below the reference PDS' },
] as const;
