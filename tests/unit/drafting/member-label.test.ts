import { describe, expect, it } from 'vitest';
import { memberSizeLabel } from '../../../shared/drafting/member-label.drafting';
import { scheduleRows } from '../../../shared/drafting/schedule.drafting';

describe('composite labels and schedule columns', () => {
  it('when a member is composite, then the label carries the studs and camber; bare members show the shape alone', () => {
    expect(memberSizeLabel('W18X35', 20, 0.75)).toBe('W18X35 (20) c=3/4"');
    expect(memberSizeLabel('W21X44', 16, 0)).toBe('W21X44 (16)');
    expect(memberSizeLabel('W16X26', null, null)).toBe('W16X26');
    expect(memberSizeLabel(null, 10, 1)).toBe('NOT SIZED');
  });
  it('when the design has studs and camber, then the schedule rows carry them', () => {
    const r = { D_kip: 1, L_kip: 1, Lr_kip: 0, S_kip: 0, Lunreduced_kip: 1, supportedBy: null };
    const rows = scheduleRows(
      { method: 'LRFD', members: [{ id: 'b1', mark: 'B1', kind: 'beam', level: 'L2', shape: 'W18X35', span_ft: 30, passes: true, governing: 'flexure', ratio: 0.9, weight_plf: 35, reactions: { start: r, end: r }, studs: 20, camber_in: 0.75 } as never] },
      { levels: [{ id: 'L2', name: 'Level 2', elevation_ft: 14 }], members: [], grids: [] },
    );
    expect(rows[0].studs).toBe(20);
    expect(rows[0].camber_in).toBe(0.75);
  });
});
