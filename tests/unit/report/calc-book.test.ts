import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { designScheme, type SchemeResult } from '../../../shared/engine/index';
import {
  buildCalcBook,
  CALC_BOOK_CAUTION,
  cellText,
  compareMarks,
  type CalcBook,
  type CalcBookInput,
  type CalcCell,
  type CalcNumber,
  type CalcSection,
} from '../../../shared/report/calc-book.report';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';

// The calc book document model, built from the two-bay fixture designed by designScheme: every
// figure it prints is compared with the design result itself, never with a typed-in number.

const fixture = (): Plan =>
  parsePlanFile(JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'))).plan!;

function book(plan: Plan, design: SchemeResult, options?: CalcBookInput['options']): CalcBook {
  return buildCalcBook({
    plan,
    design,
    project: { name: 'Harrow Quay Offices', number: 'HQ-7', client: null, address: null },
    scheme: { name: 'Scheme A', revision: 4 },
    designedRevision: 4,
    date: '2026-12-02',
    preparedBy: 'Ines Fairweather',
    options,
  });
}

/** Every string a section prints (cells through cellText). */
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

const allText = (b: CalcBook) => b.sections.map(textOf).join('\n');
const memberSections = (b: CalcBook) => b.sections.filter((s) => s.memberId !== undefined);
const tableRows = (s: CalcSection, captionStart: string): CalcCell[][] => {
  const t = s.blocks.find((b) => b.type === 'table' && (b.caption ?? '').startsWith(captionStart));
  if (!t || t.type !== 'table') throw new Error(`no table "${captionStart}" in ${s.id}`);
  return t.rows;
};

describe('buildCalcBook on the two-bay fixture', () => {
  const plan = fixture();
  const design = designScheme(plan);
  const b = book(plan, design);

  it('when built with the default (distinct), then every distinct mark has exactly one member section, in mark order', () => {
    const marks = [...new Set(design.members.map((m) => m.mark))].sort(compareMarks);
    expect(marks.length).toBeGreaterThan(1);
    expect(b.marks).toEqual(marks);
    const printed = memberSections(b).map((s) => s.mark);
    expect(printed).toEqual(marks); // one level in the fixture, so level order = mark order
    expect(memberSections(b).length).toBeLessThan(design.members.length);
  });

  it('when members=all, then every member of the design has its own section', () => {
    const all = book(plan, design, { members: 'all' });
    expect(memberSections(all).map((s) => s.memberId).sort()).toEqual(design.members.map((m) => m.id).sort());
  });

  it('when a mark is printed once, then it is the member of that mark with the highest ratio', () => {
    for (const s of memberSections(b)) {
      const same = design.members.filter((m) => m.mark === s.mark);
      const highest = Math.max(...same.map((m) => m.ratio ?? 0));
      expect(design.members.find((m) => m.id === s.memberId)!.ratio).toBe(highest);
    }
  });

  it('when built, then every check of every printed member appears with its clause, equation and combination', () => {
    for (const s of memberSections(b)) {
      const m = design.members.find((x) => x.id === s.memberId)!;
      const rows = tableRows(s, 'Checks');
      expect(rows).toHaveLength(m.design!.checks.length);
      m.design!.checks.forEach((c, i) => {
        expect(rows[i][1]).toBe(c.clause);
        expect(rows[i][2]).toBe(c.equation);
        expect(rows[i][3]).toBe(c.combination);
      });
      const text = textOf(s);
      // one working table per check, captioned with its clause
      expect(s.blocks.filter((x) => x.type === 'table' && (x.caption ?? '').startsWith('Working')).map((x) => x.type === 'table' && x.caption)).toEqual(
        m.design!.checks.map((c) => expect.stringContaining(`(${c.clause})`)),
      );
      expect(text).toContain('Governing:');
    }
  });

  it('when a member is printed, then its demand, capacity and ratio are the design result\u2019s own numbers', () => {
    const s = memberSections(b).find((x) => x.memberId === 'gA12') ?? memberSections(b)[0];
    const m = design.members.find((x) => x.id === s.memberId)!;
    const rows = tableRows(s, 'Checks');
    m.design!.checks.forEach((c, i) => {
      expect((rows[i][4] as CalcNumber).n).toBe(c.demand);
      expect((rows[i][5] as CalcNumber).n).toBe(c.capacity);
      expect((rows[i][7] as CalcNumber).n).toBe(c.ratio);
    });
    const flex = m.design!.checks.find((c) => c.name === 'flexure')!;
    const working = tableRows(s, 'Working — Flexure');
    const value = (q: string) => (working.find((r) => r[0] === q)![1] as CalcNumber).n;
    expect(value('Lp')).toBe(flex.Lp_ft);
    expect(value('Lr')).toBe(flex.Lr_ft);
    expect(value('Mp = Fy Zx')).toBe(flex.Mp_kipft);
    expect(value('Mn')).toBe(flex.Mn_kipft);
    expect(value('Cb')).toBe(flex.Cb);
    const segs = tableRows(s, 'Unbraced segments');
    expect(segs.map((r) => (r[1] as CalcNumber).n)).toEqual(m.design!.segments.map((x) => x.Lb_ft));
    const ends = tableRows(s, 'End reactions');
    expect((ends[0][2] as CalcNumber).n).toBe(m.reactions.start.D_kip);
    expect((ends[1][3] as CalcNumber).n).toBe(m.reactions.end.L_kip);
    // The support by name, never by id: the fixture's girders bear on columns at grid intersections.
    expect(m.reactions.start.supportedBy).toBe('C-A1');
    expect(cellText(ends[0][1])).toBe('column at A1');
  });

  it('when built, then the basis of design states the code editions, E, Fy and the engine\u2019s assumptions', () => {
    const basis = textOf(b.sections.find((s) => s.id === 'basis')!);
    for (const code of ['AISC 360-16', 'ASCE 7-16 §2.3.1', 'ASCE 7-16 §2.4.1', 'ASCE 7-16 §4.7', 'IBC Table 1604.3', 'AISC Shapes Database v15.0']) {
      expect(basis).toContain(code);
    }
    expect(basis).toContain('29,000'); // E = 29,000 ksi, AISC 360-16 (common practice)
    expect(basis).toContain('span/360'); // plan deflection limit, live
    expect(basis).toContain('span/240'); // plan deflection limit, total
    expect(basis).toContain('1.0L');
    expect(basis).toContain('Cb = 1.0');
    expect(basis).toContain('traced through the framing');
    // Columns are sized (AISC 360-16 Chapter E) and composite beams designed (Chapter I): the
    // assumptions say how, and no longer that columns are not sized.
    expect(basis).not.toContain('columns are not sized');
    expect(basis).toContain('Chapter E (E3, E7) with Lc = storey height and K = 1.0');
    expect(basis).toContain('Lc/r ≤ 200 (the User Note of E2) is taken as a limit'); // AISC 360-16 E2 User Note
    expect(basis).toContain('Rp = 0.6 unless the stud position in the rib'); // AISC 360-16 I8.2a
    expect(basis).toContain('at least 25 % composite'); // common practice (design basis §6)
  });

  it('when built, then the cover and the caution carry the project, scheme and the licensed-engineer notice', () => {
    const cover = textOf(b.sections[0]);
    expect(b.caution).toBe(CALC_BOOK_CAUTION);
    expect(cover).toContain(CALC_BOOK_CAUTION);
    expect(cover).toContain('Harrow Quay Offices');
    expect(cover).toContain('Scheme A');
    expect(cover).toContain('Ines Fairweather');
    expect(cover).toContain('2026-12-02');
    expect(CALC_BOOK_CAUTION).toMatch(/licensed engineer/);
    expect(CALC_BOOK_CAUTION).toMatch(/engineer of record govern/);
  });

  it('when built, then the load zones, column stack and equilibrium are the plan\u2019s and the design\u2019s', () => {
    const zones = tableRows(b.sections.find((s) => s.id === 'zones')!, 'Area loads');
    expect(zones).toHaveLength(plan.zones.length);
    expect((zones[0][4] as CalcNumber).n).toBe(plan.zones[0].live_psf);
    const cols = b.sections.find((s) => s.id === 'columns')!;
    const t = cols.blocks.find((x) => x.type === 'table');
    expect(t && t.type === 'table' && t.rows.length).toBe(design.columns.reduce((s, c) => s + c.levels.length, 0));
    if (t && t.type === 'table') expect((t.rows[0][10] as CalcNumber).n).toBe(design.columns[0].levels[0].Pr_kip);
    if (t && t.type === 'table') {
      expect(t.rows[0][8]).toBe(design.columns[0].levels[0].shape);
      expect((t.rows[0][12] as CalcNumber).n).toBe(design.columns[0].levels[0].ratio);
    }
    // One column page per sized column, with its working (AISC 360-16 E3/E7) per length
    const page = b.sections.find((s) => s.id === `column-${design.columns[0].id}`)!;
    expect(page.blocks[0].type === 'paragraph' && page.blocks[0].text).toMatch(/Eq\. E3-4/);
    const w = page.blocks.find((x) => x.type === 'table');
    if (!w || w.type !== 'table') throw new Error('no column working table');
    expect((w.rows[0][5] as CalcNumber).n).toBe(design.columns[0].levels[0].Pc_kip);
    const eq = b.sections.find((s) => s.id === 'equilibrium')!;
    const eqT = eq.blocks.find((x) => x.type === 'table');
    if (!eqT || eqT.type !== 'table') throw new Error('no equilibrium table');
    const dRow = eqT.rows.find((r) => r[0] === 'D')!;
    expect((dRow[1] as CalcNumber).n).toBe(design.equilibrium.D.applied_kip);
    expect((dRow[2] as CalcNumber).n).toBe(design.equilibrium.D.reactions_kip);
  });

  it('when every member passes, then Needs attention says so and comes right after the cover', () => {
    expect(b.sections[1].id).toBe('attention');
    expect(textOf(b.sections[1])).toContain('Every member printed here passes');
  });

  it('when a level is asked for that the plan has, then only its members are printed', () => {
    const one = book(plan, design, { levelId: 'L2' });
    expect(memberSections(one).every((s) => design.members.find((m) => m.id === s.memberId)!.level === 'L2')).toBe(true);
    const none = book(plan, design, { levelId: 'L9' });
    expect(memberSections(none)).toHaveLength(0);
  });
});

describe('buildCalcBook with a failing member', () => {
  // b1 locked to the lightest W8 (AISC Shapes Database v15.0: W8X10), far too small for its span.
  const plan = fixture();
  plan.members = plan.members.map((m) => (m.id === 'b1' ? { ...m, shape: 'W8X10' } : m));
  const design = designScheme(plan);
  const b1 = design.members.find((m) => m.id === 'b1')!;

  it('when a locked shape fails, then the member is listed in Needs attention, before the basis, with its mark and reason', () => {
    expect(b1.passes).toBe(false); // precondition from the engine itself
    const b = book(plan, design);
    const ids = b.sections.map((s) => s.id);
    expect(ids.indexOf('attention')).toBeLessThan(ids.indexOf('basis'));
    const attention = b.sections.find((s) => s.id === 'attention')!;
    const t = attention.blocks.find((x) => x.type === 'table');
    if (!t || t.type !== 'table') throw new Error('no attention table');
    // b1 runs along grid line 1 from A to B: listed by its grid location, not its id.
    const row = t.rows.find((r) => r[1] === 'A–B / 1')!;
    expect(row[0]).toBe(b1.mark);
    expect(row[2]).toBe('W8X10');
    expect((row[3] as CalcNumber).n).toBe(b1.ratio);
    expect(b1.ratio!).toBeGreaterThan(1);
    expect(t.rows.every((r) => design.members.some((m) => m.mark === r[0] && !m.passes))).toBe(true);
  });

  it('when a failing member shares its mark in distinct mode, then it is still printed in full with its warning', () => {
    const b = book(plan, design);
    const s = memberSections(b).find((x) => x.memberId === 'b1')!;
    expect(s).toBeDefined();
    expect(s.blocks[0].type).toBe('caution');
    expect(textOf(s)).toContain('DOES NOT PASS');
  });
});

describe('buildCalcBook for an ASD project', () => {
  const plan = fixture();
  plan.designBasis = { ...plan.designBasis, method: 'ASD' };
  const design = designScheme(plan);
  const b = book(plan, design);

  it('when the basis is ASD, then the basis names §2.4.1 and each strength check prints its Ω from the design', () => {
    expect(textOf(b.sections.find((s) => s.id === 'basis')!)).toContain('ASD, ASCE 7-16 §2.4.1 combinations');
    const s = memberSections(b)[0];
    const m = design.members.find((x) => x.id === s.memberId)!;
    const flex = m.design!.checks.find((c) => c.name === 'flexure')!;
    expect(flex.omega).toBeDefined(); // precondition: the engine reports Ωb for ASD
    const row = tableRows(s, 'Working — Flexure').find((r) => r[0] === 'Resistance')!;
    expect(row[1]).toBe(`Ω = ${flex.omega!.toFixed(2)} (ASD)`);
    expect(textOf(s)).toContain('capacity = Rn/Ω');
  });
});
