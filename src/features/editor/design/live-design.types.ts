import type { SchemeResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';

export interface DesignRequest {
  seq: number;
  plan: Plan;
}

import type { SchemeMember } from '../../../../shared/engine/index';

/**
 * A design, or why there is none. From the worker, `members` lists the result's members with
 * null for each one equal to the same place in its last reply (member-delta.ts), and
 * `result.members` is empty; on the main thread `result` is whole.
 */
export type DesignReply =
  | { seq: number; result: SchemeResult; members?: (SchemeMember | null)[]; engineMs: number }
  | { seq: number; error: string; engineMs: number };
