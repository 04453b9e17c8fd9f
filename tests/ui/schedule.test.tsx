import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { ScheduleTable } from '../../src/features/schedule/components/schedule-table.component';
import { ScheduleMarkTable } from '../../src/features/schedule/components/schedule-mark-table.component';
import { defaultSchemeId } from '../../src/features/schedule/components/schedule-screen.component';
import { designScheme } from '../../shared/engine/index';
import { scheduleBasis, scheduleRows } from '../../shared/drafting/schedule.drafting';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';

const plan: Plan = parsePlanFile(JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'))).plan!;
// A second level (copy of L2 as L3) so the level filter and grouping have two levels to tell apart.
const twoLevels: Plan = {
  ...plan,
  levels: [...plan.levels, { id: 'L3', name: 'Level 3', elevation_ft: 28 }],
  columns: plan.columns.map((c) => ({ ...c, levels: ['L2', 'L3'] })),
  members: [...plan.members, ...plan.members.map((m) => ({ ...m, id: `${m.id}-3`, level: 'L3' }))],
  decks: [...plan.decks, ...plan.decks.map((d) => ({ ...d, id: `${d.id}-3`, level: 'L3' }))],
  pointLoads: [],
  lineLoads: [],
  openings: [],
};
const design = designScheme(twoLevels);
const rows = scheduleRows(design, twoLevels);
const levels = twoLevels.levels.map((l) => ({ id: l.id, name: l.name }));

function renderTable(mayEditMarks = false) {
  return render(<ScheduleTable rows={rows} levels={levels} basis={scheduleBasis('LRFD')} units="US" mayEditMarks={mayEditMarks} />);
}

const bodyRows = () => within(screen.getByRole('table', { name: 'Member schedule' })).getAllByRole('row').filter((r) => r.hasAttribute('data-member'));

describe('ScheduleTable', () => {
  it('when shown, then every member has a row with its mark and size, and camber and studs columns are present', () => {
    renderTable();
    expect(bodyRows()).toHaveLength(22);
    expect(screen.getByRole('columnheader', { name: /Camber/ })).toBeInTheDocument();
    expect(screen.getByRole('columnheader', { name: 'Studs' })).toBeInTheDocument();
    expect(screen.getByText((_, el) => el?.tagName === 'P' && el.textContent === '22 of 22 members')).toBeInTheDocument();
  });

  it('when a member is governed by a check, then the Governs column names it in words, never the engine id', () => {
    renderTable();
    const table = screen.getByRole('table', { name: 'Member schedule' });
    expect(within(table).queryByText(/^(deflectionTotal|deflectionLive)$/)).toBeNull();
    const words: Record<string, string> = { flexure: 'flexure', shear: 'shear', deflectionLive: 'live-load deflection', deflectionTotal: 'total-load deflection' };
    for (const r of bodyRows()) {
      const row = rows.find((x) => x.memberId === r.getAttribute('data-member'))!;
      const cells = Array.from(r.querySelectorAll('td')).map((td) => td.textContent);
      expect(cells).toContain(words[row.governing!]);
    }
  });

  it('when filtered by text, level and kind, then only matching members remain', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.type(screen.getByRole('searchbox'), '3G');
    expect(bodyRows().map((r) => r.getAttribute('data-member'))).toEqual(expect.arrayContaining(['gA12-3', 'gB12-3']));
    expect(bodyRows().every((r) => r.getAttribute('data-member')!.endsWith('-3'))).toBe(true);
    expect(bodyRows()).toHaveLength(4);
    await user.clear(screen.getByRole('searchbox'));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Level' }), 'L2');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Kind' }), 'beam');
    const ids = bodyRows().map((r) => r.getAttribute('data-member'));
    expect(ids.sort()).toEqual(['b1', 'b2', 'b3', 'b4', 'b5', 'b6', 'b7']);
  });

  it('when grouped by level, then each level heads its own members; by kind, girders and beams', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Group by' }), 'level');
    let groups = screen.getAllByTestId('schedule-group');
    expect(groups.map((g) => g.textContent)).toEqual(['Level 211 members', 'Level 311 members']);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Group by' }), 'kind');
    groups = screen.getAllByTestId('schedule-group');
    expect(groups.map((g) => g.textContent)).toEqual(expect.arrayContaining(['Girders8 members', 'Beams14 members']));
    expect(bodyRows()).toHaveLength(22);
  });

  it('when sorted by span, then the shortest span comes first', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: /Span \(ft\)/ }));
    const first = bodyRows()[0].getAttribute('data-member')!;
    expect(rows.find((r) => r.memberId === first)!.span_ft).toBe(Math.min(...rows.map((r) => r.span_ft)));
  });

  it('when the reader may not edit marks, then there is no edit control; when they may, there is one per member', () => {
    const { unmount } = renderTable(false);
    expect(screen.queryByRole('button', { name: /Edit mark/ })).toBeNull();
    unmount();
    renderTable(true);
    expect(screen.getAllByRole('button', { name: /Edit mark/ })).toHaveLength(22);
  });
});

describe('ScheduleMarkTable: one row per mark', () => {
  const markRows = () => within(screen.getByRole('table', { name: 'Schedule by mark' })).getAllByRole('row').filter((r) => r.hasAttribute('data-mark'));

  it('when shown, then each mark has one row with its quantity, and the reactions are headed as the envelope of the ends', () => {
    render(<ScheduleMarkTable rows={rows} levels={levels} basis={scheduleBasis('LRFD')} units="US" mayEditMarks={false} />);
    const marks = new Set(rows.map((r) => `${r.level} ${r.mark}`));
    expect(markRows()).toHaveLength(marks.size);
    const total = markRows().reduce((n, r) => n + Number(r.getAttribute('data-quantity')), 0);
    expect(total).toBe(22);
    for (const r of markRows()) {
      const mark = r.getAttribute('data-mark')!;
      const n = rows.filter((x) => x.mark === mark).length;
      expect(Number(r.getAttribute('data-quantity'))).toBe(n);
    }
    expect(screen.getByRole('columnheader', { name: /Reaction, envelope of the ends \(kip\)/ })).toBeInTheDocument();
    expect(screen.queryByText(/^×\d+$/)).toBeNull();
  });

  it('when the Level and Kind columns are unticked in Columns, then they are not shown', async () => {
    const user = userEvent.setup();
    render(<ScheduleMarkTable rows={rows} levels={levels} basis={scheduleBasis('LRFD')} units="US" mayEditMarks={false} />);
    expect(screen.getByRole('columnheader', { name: 'Level' })).toBeInTheDocument();
    await user.click(screen.getByText(/^Columns \(/));
    await user.click(screen.getByRole('checkbox', { name: 'Level' }));
    await user.click(screen.getByRole('checkbox', { name: 'Kind' }));
    expect(screen.queryByRole('columnheader', { name: 'Level' })).toBeNull();
    expect(screen.queryByRole('columnheader', { name: 'Kind' })).toBeNull();
  });

  it('when a drafter edits the mark of a row, then every member of the row is given the new mark', async () => {
    const user = userEvent.setup();
    const saved: [string[], string | null][] = [];
    render(<ScheduleMarkTable rows={rows} levels={levels} basis={scheduleBasis('LRFD')} units="US" mayEditMarks onSaveMarks={async (ids, mark) => void saved.push([ids, mark])} />);
    const row = markRows().find((r) => Number(r.getAttribute('data-quantity')) > 1)!;
    const mark = row.getAttribute('data-mark')!;
    await user.click(within(row).getByRole('button', { name: /^Edit mark of the/ }));
    const input = within(row).getByRole('textbox');
    await user.clear(input);
    await user.type(input, 'B-TYP');
    await user.click(within(row).getByRole('button', { name: 'Save' }));
    expect(saved).toHaveLength(1);
    expect(saved[0][1]).toBe('B-TYP');
    expect(saved[0][0].sort()).toEqual(rows.filter((r) => r.mark === mark).map((r) => r.memberId).sort());
  });
});

describe('defaultSchemeId', () => {
  it('when a scheme is chosen, then it is the default; otherwise the first', () => {
    expect(defaultSchemeId([{ id: 'a', name: 'A', status: 'draft' }, { id: 'b', name: 'B', status: 'chosen' }])).toBe('b');
    expect(defaultSchemeId([{ id: 'a', name: 'A', status: 'draft' }, { id: 'b', name: 'B', status: 'in_review' }])).toBe('a');
  });
});
