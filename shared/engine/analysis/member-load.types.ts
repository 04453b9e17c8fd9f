import type { LoadCase } from '../loads/combinations';

/** A load on a simple-span member; positions in ft from the start support, loads downward ≥ 0. */
export type MemberLoad =
  | { case: LoadCase; kind: 'uniform'; w_klf: number; source?: string }
  | { case: LoadCase; kind: 'partial'; w_klf: number; from_ft: number; to_ft: number; source?: string }
  | { case: LoadCase; kind: 'linear'; w1_klf: number; w2_klf: number; from_ft: number; to_ft: number; source?: string }
  | { case: LoadCase; kind: 'point'; P_kip: number; x_ft: number; source?: string };
