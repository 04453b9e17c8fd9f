import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { designScheme } from '../../../shared/engine/index';
import { factoredReaction, scheduleRows } from '../../../shared/drafting/schedule.drafting';
import { csvField, parseCsv, SCHEDULE_CSV_COLUMNS, scheduleCsv } from '../../../shared/drafting/schedule-csv.drafting';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';

const fixture = (): Plan =>
  parsePlanFile(JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'))).plan!;

describe('factoredReaction', () => {
  it('when a floor reaction has D and L, then LRFD takes 1.2D+1.6L and ASD D+L', () => {
    // ASCE 7-16 §2.3.1 comb. 2 and §2.4.1 comb. 2, worked by hand: 1.2·10 + 1.6·15 = 36; 10 + 15 = 25
    expect(factoredReaction('LRFD', { D_kip: 10, L_kip: 15, Lr_kip: 0, S_kip: 0 })).toEqual({ factored_kip: 36, combination: '1.2D+1.6L' });
    expect(factoredReaction('ASD', { D_kip: 10, L_kip: 15, Lr_kip: 0, S_kip: 0 })).toEqual({ factored_kip: 25, combination: 'D+L' });
  });

  it('when dead load dominates, then LRFD 1.4D governs', () => {
    // ASCE 7-16 §2.3.1 comb. 1 by hand: 1.4·20 = 28 > 1.2·20 + 1.6·0.5 = 24.8
    const r = factoredReaction('LRFD', { D_kip: 20, L_kip: 0.5, Lr_kip: 0, S_kip: 0 });
    expect(r.factored_kip).toBeCloseTo(28, 12);
    expect(r.combination).toBe('1.4D');
  });

  it('when a roof reaction has snow, then the snow combination is not left out', () => {
    // ASCE 7-16 §2.3.1 comb. 3 by hand: 1.2·10 + 1.6·12 = 31.2 (no L present)
    const r = factoredReaction('LRFD', { D_kip: 10, L_kip: 0, Lr_kip: 0, S_kip: 12 });
    expect(r.factored_kip).toBeCloseTo(31.2, 12);
    expect(r.combination).toBe('1.2D+1.6S');
  });
});

describe('scheduleRows on the two-bay fixture', () => {
  const plan = fixture();
  const design = designScheme(plan);
  const rows = scheduleRows(design, plan);

  it('when built, then there is one row per designed member with its mark, size and span', () => {
    expect(rows).toHaveLength(design.members.length);
    for (const m of design.members) {
      const row = rows.find((r) => r.memberId === m.id)!;
      expect(row.mark).toBe(m.mark);
      expect(row.size).toBe(m.shape);
      expect(row.span_ft).toBe(m.span_ft);
      expect(row.start.D_kip).toBe(m.reactions.start.D_kip);
      expect(row.end.L_kip).toBe(m.reactions.end.L_kip);
    }
  });

  it('when beams share a mark, then the count says how many', () => {
    const b2 = rows.find((r) => r.memberId === 'b2')!;
    const same = design.members.filter((m) => m.level === 'L2' && m.mark === b2.mark).length;
    expect(same).toBeGreaterThan(1);
    expect(b2.count).toBe(same);
  });

  it('when a beam is on no grid line, then its location gives the offset from line 1', () => {
    expect(rows.find((r) => r.memberId === 'b2')!.gridLocation).toBe('A–B / 1+10\'-0"');
    expect(rows.find((r) => r.memberId === 'gA12')!.gridLocation).toBe('1–2 / A');
    expect(rows.find((r) => r.memberId === 'b4')!.gridLocation).toBe('A–B / 2');
  });

  it('when the basis is LRFD, then each end is 1.2D+1.6L of its own reactions', () => {
    const b2 = rows.find((r) => r.memberId === 'b2')!;
    // ASCE 7-16 §2.3.1 comb. 2 (floor: no Lr or S on this plan)
    expect(b2.start.factored_kip).toBeCloseTo(1.2 * b2.start.D_kip + 1.6 * b2.start.L_kip, 12);
    expect(b2.start.combination).toBe('1.2D+1.6L');
  });

  it('when composite design is absent, then camber and studs are empty', () => {
    expect(rows.every((r) => r.camber_in === null && r.studs === null)).toBe(true);
  });

  it('when sorted, then marks run in numeric order within a level', () => {
    const marks = rows.map((r) => r.mark);
    expect(marks.indexOf('2B1')).toBeLessThan(marks.indexOf('2B2'));
    expect(marks.indexOf('2B2')).toBeLessThan(marks.indexOf('2G1'));
  });
});

describe('scheduleCsv', () => {
  const plan = fixture();
  const rows = scheduleRows(designScheme(plan), plan);
  const csv = scheduleCsv(rows);
  const records = parseCsv(csv);

  it('when written, then the first line is the header with units in the names and lines end CRLF', () => {
    expect(csv.split('\r\n')[0]).toBe(SCHEDULE_CSV_COLUMNS.map((c) => c.header).join(','));
    expect(records[0]).toEqual(expect.arrayContaining(['mark', 'size', 'span_ft', 'R_start_D_kip', 'R_end_L_kip']));
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.replace(/\r\n/g, '')).not.toMatch(/\n/);
  });

  it('when parsed back, then every row matches its member', () => {
    expect(records).toHaveLength(rows.length + 1);
    const h = records[0];
    for (let i = 0; i < rows.length; i++) {
      const rec = Object.fromEntries(h.map((name, j) => [name, records[i + 1][j]]));
      expect(rec.member_id).toBe(rows[i].memberId);
      expect(rec.mark).toBe(rows[i].mark);
      expect(rec.size).toBe(rows[i].size);
      expect(Number(rec.span_ft)).toBeCloseTo(rows[i].span_ft, 3);
      expect(Number(rec.R_start_D_kip)).toBeCloseTo(rows[i].start.D_kip, 3);
      expect(rec.grid_location).toBe(rows[i].gridLocation);
    }
  });

  it('when a field holds a comma, quote or line break, then it is quoted with quotes doubled (RFC 4180 §2)', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('10\'-0" bay')).toBe('"10\'-0"" bay"');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(parseCsv('x,"a ""q"", b"\r\n')).toEqual([['x', 'a "q", b']]);
  });
});

describe('scheduleMarkRows: one row per mark', () => {
  const plan = fixture();
  const design = designScheme(plan);
  const rows = scheduleRows(design, plan);

  it('when members share a mark, then one row carries the quantity, every member and the envelope of their end reactions', async () => {
    const { scheduleMarkRows } = await import('../../../shared/drafting/schedule.drafting');
    const byMark = scheduleMarkRows(rows);
    expect(byMark.reduce((n, r) => n + r.quantity, 0)).toBe(rows.length);
    expect(new Set(byMark.map((r) => r.key)).size).toBe(byMark.length);
    for (const mr of byMark) {
      const members = rows.filter((r) => r.mark === mr.mark && r.level === mr.level);
      expect(mr.quantity).toBe(members.length);
      expect(mr.memberIds.sort()).toEqual(members.map((r) => r.memberId).sort());
      const ends = members.flatMap((r) => [r.start, r.end]);
      // Envelope: the largest of each case over every end (common practice for a piece schedule).
      expect(mr.reaction.D_kip).toBe(Math.max(...ends.map((e) => e.D_kip)));
      expect(mr.reaction.L_kip).toBe(Math.max(...ends.map((e) => e.L_kip)));
      expect(mr.reaction.factored_kip).toBe(Math.max(...ends.map((e) => e.factored_kip)));
      expect(mr.ratio).toBe(Math.max(...members.map((r) => r.ratio ?? -1)));
      expect(mr.split).toBe(false);
    }
    expect(byMark.some((r) => r.quantity > 1)).toBe(true);
  });

  it('when a locked mark is carried by two sizes, then it is split into one row per size, each saying so', async () => {
    const { scheduleMarkRows } = await import('../../../shared/drafting/schedule.drafting');
    const edited = structuredClone(rows);
    const a = edited.find((r) => r.kind === 'beam')!;
    const b = edited.find((r) => r.kind === 'beam' && r.size !== a.size)!;
    a.mark = 'B-X';
    b.mark = 'B-X';
    const split = scheduleMarkRows(edited).filter((r) => r.mark === 'B-X');
    expect(split.map((r) => r.size).sort()).toEqual([a.size, b.size].sort());
    expect(split.every((r) => r.split && r.quantity === 1)).toBe(true);
  });

  it('when written as CSV, then the header comes first and there is one line per mark row, nothing else', async () => {
    const { scheduleMarkRows } = await import('../../../shared/drafting/schedule.drafting');
    const { SCHEDULE_MARK_CSV_COLUMNS } = await import('../../../shared/drafting/schedule-csv.drafting');
    const byMark = scheduleMarkRows(rows);
    const records = parseCsv(scheduleCsv(byMark, SCHEDULE_MARK_CSV_COLUMNS));
    expect(records[0]).toEqual(SCHEDULE_MARK_CSV_COLUMNS.map((c) => c.header));
    expect(records).toHaveLength(byMark.length + 1);
    expect(records.every((r) => r.length === SCHEDULE_MARK_CSV_COLUMNS.length)).toBe(true);
  });
});
