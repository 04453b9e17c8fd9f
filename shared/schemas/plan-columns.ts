import { findWShape } from '../catalog/w-shapes.catalog';
import { planProblem, type PlanProblem } from './plan-problem.schema';
import type { Plan } from './plan.schema';

/**
 * Column input that cannot be designed (design-basis §8): a column with no levels, a splice at
 * a level the column does not reach, a locked size (of the column or of a tier) that
 * is not a W-shape of AISC Shapes Database v15.0, project splice levels naming no level.
 * Checked when a plan is saved or imported and by `calc plan` (exit 2).
 */
export function columnInputProblems(plan: Plan): PlanProblem[] {
  const problems: PlanProblem[] = [];
  const levelIds = new Set(plan.levels.map((l) => l.id));
  plan.columns.forEach((c, i) => {
    const where = `columns[${i}] (id ${c.id.slice(0, 40)})`;
    if (c.levels.length === 0) {
      problems.push(planProblem('error', 'column-no-levels', `${where}.levels: column ${c.id} has no levels; give it at least one level it supports`, { elementId: c.id, path: `${where}.levels` }));
    }
    (c.spliceLevels ?? []).forEach((s, k) => {
      const path = `${where}.spliceLevels[${k}]`;
      if (!c.levels.includes(s)) {
        problems.push(planProblem('error', 'column-splice-unreached', `${path}: column ${c.id} does not reach level "${s}", so it cannot be spliced there`, { elementId: c.id, path }));
      }
    });
    (c.tierShapes ?? []).forEach((t, k) => {
      const path = `${where}.tierShapes[${k}]`;
      if (!c.levels.includes(t.level)) {
        problems.push(planProblem('error', 'column-tier-unreached', `${path}.level: column ${c.id} does not reach level "${t.level.slice(0, 40)}", so no tier of it can be locked there`, { elementId: c.id, path: `${path}.level` }));
      }
      if (!(/^W\d/i.test(t.shape.trim()) && findWShape(t.shape))) {
        problems.push(planProblem('error', 'column-shape-not-w', `${path}.shape: "${t.shape.slice(0, 40)}" is not a W-shape in AISC Shapes Database v15.0; lock a W-shape such as W14X90, or remove the lock to size the tier`, { elementId: c.id, path: `${path}.shape` }));
      }
    });
    if (c.shape != null && c.shape.trim() !== '' && !(/^W\d/i.test(c.shape.trim()) && findWShape(c.shape))) {
      problems.push(planProblem('error', 'column-shape-not-w', `${where}.shape: "${c.shape.slice(0, 40)}" is not a W-shape in AISC Shapes Database v15.0; lock a W-shape such as W14X90, or leave it empty to size it`, { elementId: c.id, path: `${where}.shape` }));
    }
  });
  (plan.designBasis.columns?.spliceLevels ?? []).forEach((s, k) => {
    if (!levelIds.has(s)) {
      const path = `designBasis.columns.spliceLevels[${k}]`;
      problems.push(planProblem('error', 'unknown-level', `${path}: level "${s.slice(0, 40)}" is not in levels`, { path }));
    }
  });
  return problems;
}
