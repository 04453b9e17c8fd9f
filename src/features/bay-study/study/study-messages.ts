import type { StudyResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../../shared/schemas/study.schema';

/** warm: design the plan now (the study's base), so a run that follows starts warm. */
export type StudyRequestMessage = { type: 'warm'; plan: Plan } | { type: 'run'; plan: Plan; spec: StudySpec };

export type StudyReplyMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'done'; result: StudyResult; engineMs: number }
  | { type: 'error'; message: string; problems: string[] };
