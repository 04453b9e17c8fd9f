import { describe, expect, it } from 'vitest';
import { parseMemberInput } from '../../../shared/schemas/member.schema';

const good = {
  span_ft: 32,
  loads: [{ case: 'D', kind: 'uniform', w_klf: 0.6 }, { case: 'L', kind: 'point', P_kip: 6, x_ft: 16 }],
  bracing: { points_ft: [10.67, 21.33] },
  method: 'LRFD',
};

describe('member input schema (calc-interface.md `calc member`)', () => {
  it('when optional fields are left out, then Fy = 50 ksi, self weight on and L/360, L/240 are filled in', () => {
    const r = parseMemberInput(good);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.input.Fy_ksi).toBe(50); // ASTM A992, common practice (calc-interface default)
      expect(r.input.includeSelfWeight).toBe(true);
      expect(r.input.deflectionLimits).toEqual({ live: 360, total: 240 }); // IBC Table 1604.3 floor members
    }
  });

  it('when fields are wrong, then every problem names its path', () => {
    const r = parseMemberInput({
      ...good,
      span_ft: 32,
      loads: [
        { case: 'D', kind: 'partial', w_klf: -1, from_ft: 20, to_ft: 10 },
        { case: 'L', kind: 'linear', w1_klf: 1, w2_klf: 2, from_ft: 0, to_ft: 33 },
      ],
      bracing: { points_ft: [40] },
      Fy_ksi: 250,
      deflectionLimits: { live: 0, total: null },
      minDepth_in: 20, maxDepth_in: 12,
      Lb_override_ft: 50,
    });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toEqual([
        'loads[0].w_klf: must be 0 or more (gravity loads act downward)',
        'loads[0].to_ft: must be greater than from_ft',
        'loads[1].to_ft: must be within the span 0–32 ft',
        'bracing.points_ft[0]: must be within the span 0–32 ft',
        'Fy_ksi: must be between 30 and 70 ksi',
        'deflectionLimits.live: must be a positive span/n denominator or null',
        'minDepth_in: must not exceed maxDepth_in',
        'Lb_override_ft: must be between 0 and the span (0–32 ft) or null',
      ]);
    }
  });

  it('when a kind or case is unknown or a field is extra, then the problem names it', () => {
    const r = parseMemberInput({ ...good, loads: [{ case: 'W', kind: 'uniform', w_klf: 1 }, { case: 'D', kind: 'moment' }], extra: 1 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toContain('loads[0].case: must be one of D, L, Lr, S');
      expect(r.problems).toContain('loads[1].kind: must be one of uniform, partial, linear, point');
      expect(r.problems).toContain('extra: unknown field');
    }
  });

  it('when there is no load and self weight is off, then the loads field is named', () => {
    const r = parseMemberInput({ ...good, loads: [], includeSelfWeight: false });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toEqual(['loads: needs at least one load above 0 (or includeSelfWeight)']);
  });
});
