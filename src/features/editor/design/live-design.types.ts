import type { SchemeResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';

export interface DesignRequest {
  seq: number;
  plan: Plan;
}

export type DesignReply = { seq: number; result: SchemeResult; engineMs: number } | { seq: number; error: string; engineMs: number };
