/**
 * NEC Table 430.52(C)(1): maximum rating or setting of motor branch-circuit short-circuit and
 * ground-fault protective devices, % of the motor's full-load current (Table 430.250 / 430.248,
 * per 430.6(A)(1)), for single-phase, polyphase squirrel-cage (other than Design B energy-efficient)
 * and Design B energy-efficient motors where the percentages agree. 430.52(C)(1) Exception No. 1:
 * where the value does not correspond to a standard rating (240.6(A)), the next higher standard
 * rating is permitted.
 *
 * Source: NFPA 70-2023 Table 430.52(C)(1) (2020: Table 430.52). Percentages FROM MEMORY (they are
 * reproduced in every motor-circuit training text; check them against the code). The instantaneous
 * trip breaker (800 %, 1100 % for Design B energy-efficient) is not carried: it is only permitted
 * as part of a listed combination controller (430.52(C)(3)).
 *
 * Units: per cent of full-load current.
 */
import type { Provenance } from './conductor-materials.ts';

export type Nec43052Device = 'inverse-time-breaker' | 'time-delay-fuse' | 'non-time-delay-fuse';

export interface Nec43052Row {
  readonly device: Nec43052Device;
  /** Device as the table names it. */
  readonly words: string;
  readonly percentOfFlc: number;
  readonly provenance: Provenance;
}

export const NEC_430_52_C_1: readonly Nec43052Row[] = [
  { device: 'non-time-delay-fuse', words: 'nontime-delay fuse', percentOfFlc: 300, provenance: 'from memory' },
  { device: 'time-delay-fuse', words: 'dual-element (time-delay) fuse', percentOfFlc: 175, provenance: 'from memory' },
  { device: 'inverse-time-breaker', words: 'inverse time breaker', percentOfFlc: 250, provenance: 'from memory' },
];
