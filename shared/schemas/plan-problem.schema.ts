/**
 * A problem found in a plan: by the parser, the repair step, the topology or the takedown.
 * Every problem names the element it concerns (elementId) and, where it came from the file,
 * the JSON path (e.g. "members[3].start").
 */
export type PlanProblemSeverity = 'error' | 'warning';

export interface PlanProblem {
  severity: PlanProblemSeverity;
  /** Stable machine code, e.g. "member-end-unsupported". */
  code: string;
  /** Human sentence naming the element, e.g. "Member m7: end (10, 36) lands on nothing". */
  message: string;
  /** Id of the element concerned, when there is one. */
  elementId?: string;
  /** JSON path in the plan file, e.g. "members[3].start". */
  path?: string;
}

export function planProblem(
  severity: PlanProblemSeverity,
  code: string,
  message: string,
  extra: { elementId?: string; path?: string } = {},
): PlanProblem {
  const p: PlanProblem = { severity, code, message };
  if (extra.elementId !== undefined) p.elementId = extra.elementId;
  if (extra.path !== undefined) p.path = extra.path;
  return p;
}
