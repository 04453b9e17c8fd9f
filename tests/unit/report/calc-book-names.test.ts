import { describe, expect, it } from 'vitest';
import { designScheme } from '../../../shared/engine/index';
import { buildCalcBook, cellText, type CalcSection } from '../../../shared/report/calc-book.report';
import { describeProblem, planNamer } from '../../../shared/drafting/element-names.drafting';
import { buildDemoBuildingPlan } from '../../../server/db/demo-building.builder';
import { DEMO_SCHEMES } from '../../../server/db/seed-demo-building';
import type { Plan } from '../../../shared/schemas/plan.schema';

// Issue 16 item 11: what a person reads names elements by mark, grid location and level
// name. The demo building's Calc book and its design problems (as the Plan shows them) are
// scanned for every element id of the plan that looks like an id (it has a digit: L2-BA12,
// g2, d3, C-A1); none may appear as a word.

function textOf(s: CalcSection): string {
  const out: string[] = [s.title];
  for (const b of s.blocks) {
    if (b.type === 'heading' || b.type === 'paragraph' || b.type === 'caution') out.push(b.text);
    else if (b.type === 'list') out.push(...b.items);
    else if (b.type === 'fields') for (const [k, v] of b.rows) out.push(k, cellText(v));
    else {
      if (b.caption) out.push(b.caption);
      out.push(...b.columns.map((c) => c.label));
      for (const r of b.rows) out.push(...r.map(cellText));
    }
  }
  return out.join('\n');
}

function idsOf(plan: Plan): string[] {
  const all = [plan.levels, plan.columns, plan.members, plan.decks, plan.zones, plan.pointLoads, plan.lineLoads, plan.openings].flatMap((list) => list.map((e) => e.id));
  return [...new Set(all)].filter((id) => /\d/.test(id));
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
function idsIn(text: string, ids: readonly string[]): string[] {
  return ids.filter((id) => new RegExp(`(^|[^\\w-])${escape(id)}(?![\\w-])`).test(text));
}

describe('the demo building speaks in marks, grid locations and level names', () => {
  const demo = DEMO_SCHEMES[0];
  const plan = buildDemoBuildingPlan({ name: demo.name, beamSpacing_ft: demo.beamSpacing_ft });
  const design = designScheme(plan);
  const ids = idsOf(plan);

  it('when the demo is designed, then its plan has ids of the kinds the scan looks for', () => {
    // A scan that finds nothing must be able to find something.
    expect(ids.length).toBeGreaterThan(50);
    expect(idsIn('load from beam ' + ids[0] + ' reaction', ids)).toEqual([ids[0]]);
  });

  it('when its Calc book is built with every member, then no element id appears in its text', () => {
    const book = buildCalcBook({
      plan,
      design,
      project: { name: 'Harrow Quay Clinic', number: null, client: null, address: null },
      scheme: { name: demo.name, revision: 1 },
      designedRevision: 1,
      date: '2026-12-02',
      preparedBy: 'Tobias Renfrew',
      options: { members: 'all' },
    });
    const text = book.sections.map(textOf).join('\n');
    expect(text.length).toBeGreaterThan(10_000);
    expect(idsIn(text, ids)).toEqual([]);
    // Figures in sentences are written out (the column paragraph printed "[object Object] lb").
    expect(text).not.toContain('[object Object]');
  }, 120_000);

  it('when its design problems are shown as the Plan shows them, then none names an element id', () => {
    const names = planNamer(plan, new Map(design.members.map((m) => [m.id, m.mark])));
    const shown = (design.problems ?? []).map((p) => describeProblem(p.message, names));
    expect(shown.flatMap((line) => idsIn(line, ids).map((id) => `${id} in "${line}"`))).toEqual([]);
  });
});
