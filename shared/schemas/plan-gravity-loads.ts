import { planProblem, type PlanProblem } from './plan-problem.schema';
import type { Plan } from './plan.schema';

/**
 * Placed point and line loads are gravity loads: a negative one would be uplift, which no
 * combination here designs for (ASCE 7-16 §2.3.1 and §2.4.1, gravity only), and would quietly
 * lower the demand. Checked when a plan is saved or imported, not when a stored one is read,
 * so a plan saved before this rule still opens and can be corrected.
 */
export function gravityLoadProblems(plan: Plan): PlanProblem[] {
  const problems: PlanProblem[] = [];
  const check = (collection: string, i: number, id: string | undefined, field: string, value: number | undefined) => {
    if (value !== undefined && value < 0) {
      const path = `${collection}[${i}]${id ? ` (id ${id.slice(0, 40)})` : ''}.${field}`;
      problems.push(planProblem('error', 'negative-load', `${path}: must be 0 or more (gravity loads only; uplift is not designed)`, { elementId: id, path }));
    }
  };
  plan.pointLoads.forEach((l, i) => (['D_kip', 'L_kip', 'Lr_kip', 'S_kip'] as const).forEach((f) => check('pointLoads', i, l.id, f, l[f])));
  plan.lineLoads.forEach((l, i) => (['D_klf', 'L_klf', 'Lr_klf', 'S_klf'] as const).forEach((f) => check('lineLoads', i, l.id, f, l[f])));
  return problems;
}

