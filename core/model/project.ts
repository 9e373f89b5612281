/**
 * The project model: plain, JSON-serialisable data describing a power chain as a tree.
 *
 * Units inside `core/` are SI throughout: volts, amperes, watts, var, volt-amperes, hertz,
 * metres, ohms, kelvin differences in °C. Display units are converted in `web/format/` only.
 *
 * The types are split by part, each file one part of the file format: element-base.ts (ports, loss
 * and power-factor models, ids), sources.ts, stages.ts, conductor-specs.ts (cable links),
 * loads.ts, circuit-network.ts, study-settings.ts (pump duty, drop limits, backup study). This file
 * holds the project itself and re-exports every part, so importers name one file.
 */
import type { Source } from './sources.ts';
import type { Stage } from './stages.ts';
import type { Load } from './loads.ts';
import type { BackupStudy, DropLimits, PumpDutyStudy, RunningCost } from './study-settings.ts';
import type { StandbySettings } from './standby.ts';
import type { ProjectVariant } from './variants.ts';
import type { SpreadSettings } from './spread.ts';
import type { OptionSearch } from './option-search.ts';

export type { PortKind, PfSense, EfficiencyPoint, LossModel, PowerFactorModel, ProtectiveDevice } from './element-base.ts';
export type { AcSource, BatteryBankSpec, BatterySource, Source } from './sources.ts';
export * from './stages.ts';
export type { NecRaceway, IecInstallationMethod, NecConductorSpec, IecConductorSpec, ConductorSpec, CableStage } from './conductor-specs.ts';
export * from './loads.ts';
export * from './circuit-network.ts';
export * from './study-settings.ts';
export type { StandbySettings } from './standby.ts';
export type { ProjectVariant } from './variants.ts';
export type { SpreadSettings } from './spread.ts';
export type { OptionSearch } from './option-search.ts';

/** Longest client, site or prepared-by text (one printed line or two on the report's first page). */
export const REPORT_TEXT_MAX = 200;

export type Element = Source | Stage | Load;
export type ElementKind = Element['kind'];

/** A whole project as stored and exchanged (schema-versioned). */
export interface Project {
  format: 'joulepath-project';
  version: 2;
  name: string;
  description?: string;
  /** Who the project is for, printed on the client report's first page (at most REPORT_TEXT_MAX characters). */
  client?: string;
  /** Where the installation is (address or site name), printed on the client report's first page. */
  site?: string;
  /** Who prepared the design (name, firm, licence number), printed on the client report's first page. */
  preparedBy?: string;
  /** Every element of the tree; the single source has no `from`. Order does not matter. */
  elements: Element[];
  /** Battery backup study (runtime, sizing, recharge) for a project fed by a battery `bank`. */
  backup?: BackupStudy;
  /** Voltage-drop limits the whole-path check flags against (default: 3 % per link, 5 % total). */
  dropLimits?: DropLimits;
  /** Flow-control comparison at a duty profile for a `pump` or `fan` element (core/studies/machines/pump-duty.ts). */
  pumpDuty?: PumpDutyStudy;
  /** Energy price and hours a year, for what the losses cost (core/studies/economics.ts). */
  running?: RunningCost;
  /** A bank on a bus: the charger sizing, float and standing-loss settings of the two modes (core/model/standby.ts). */
  standby?: StandbySettings;
  /** Named variants of the chain, solved side by side with it (core/model/variants.ts). */
  variants?: ProjectVariant[];
  /** Tolerances of the runtime with its spread, sampled by core/studies/spread/ (core/model/spread.ts). */
  spread?: SpreadSettings;
  /** The search for the option that meets a target: the target and the candidates (core/model/option-search.ts). */
  optionSearch?: OptionSearch;
}
