import type { StudyResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../../shared/schemas/study.schema';

export interface StudyRequestMessage {
  plan: Plan;
  spec: StudySpec;
}

export type StudyReplyMessage =
  | { type: 'progress'; done: number; total: number }
  | { type: 'done'; result: StudyResult; engineMs: number }
  | { type: 'error'; message: string; problems: string[] };
