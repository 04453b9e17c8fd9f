import { describe, expect, it } from 'vitest';
import { loadCombinations, sharedLoadCombinations } from '../../../shared/engine/loads/combinations';

const names = (...a: Parameters<typeof loadCombinations>) => loadCombinations(...a).map((c) => c.name);

describe('ASCE 7-16 load combinations', () => {
  it('when only D and L are present (LRFD), then 1.4D and 1.2D+1.6L are generated (ASCE 7-16 §2.3.1 (1), (2))', () => {
    expect(names('LRFD', ['D', 'L'])).toEqual(['1.4D', '1.2D+1.6L']);
    const c = loadCombinations('LRFD', ['D', 'L'])[1];
    expect(c.factors).toEqual({ D: 1.2, L: 1.6, Lr: 0, S: 0 }); // ASCE 7-16 §2.3.1 combination 2
    expect(c.clause).toBe('ASCE 7-16 §2.3.1 (2)');
  });

  it('when roof live and snow are present (LRFD), then each is combined separately with 1.0L unless 0.5L is flagged', () => {
    expect(names('LRFD', ['D', 'L', 'Lr', 'S'])).toEqual([
      '1.4D', '1.2D+1.6L+0.5Lr', '1.2D+1.6L+0.5S', '1.2D+1.6Lr+1.0L', '1.2D+1.6S+1.0L',
    ]); // ASCE 7-16 §2.3.1 (1)–(3), L factor 1.0 (conservative reading of exception 1)
    expect(names('LRFD', ['D', 'L', 'S'], { liveLoadFactorHalf: true })).toEqual(['1.4D', '1.2D+1.6L+0.5S', '1.2D+1.6S+0.5L']);
  });

  it('when only D and L are present (ASD), then D+L alone remains (D alone is dominated for loads ≥ 0)', () => {
    expect(names('ASD', ['D', 'L'])).toEqual(['D+L']); // ASCE 7-16 §2.4.1 (2)
    expect(names('ASD', ['D'])).toEqual(['D']); // ASCE 7-16 §2.4.1 (1)
  });

  it('when Lr and S are present (ASD), then D+(Lr or S) and D+0.75L+0.75(Lr or S) are generated', () => {
    expect(names('ASD', ['D', 'L', 'Lr', 'S'])).toEqual(['D+L', 'D+Lr', 'D+S', 'D+0.75L+0.75Lr', 'D+0.75L+0.75S']);
    expect(loadCombinations('ASD', ['D', 'L', 'S'])[2].factors).toEqual({ D: 1, L: 0.75, Lr: 0, S: 0.75 }); // §2.4.1 (4)
  });

  it('when a case is absent, then no combination names it and only D-only combinations remain for D alone (LRFD)', () => {
    expect(names('LRFD', ['D'])).toEqual(['1.4D']); // 1.2D is dominated by 1.4D
    expect(names('LRFD', ['D', 'S'])).toEqual(['1.4D', '1.2D+1.6S']);
  });

  it('when a returned combination is mutated, then the next call is unaffected (cache is private)', () => {
    loadCombinations('LRFD', ['D', 'L'])[1].factors.L = 99;
    expect(loadCombinations('LRFD', ['D', 'L'])[1].factors.L).toBe(1.6);
  });

  it('when the shared list is read, then it is the one cached list, frozen, equal to the copies callers get', () => {
    const shared = sharedLoadCombinations('LRFD', ['D', 'L', 'S']);
    expect(sharedLoadCombinations('LRFD', ['S', 'L', 'D'])).toBe(shared);
    expect(shared).toEqual(loadCombinations('LRFD', ['D', 'L', 'S']));
    expect(Object.isFrozen(shared) && shared.every((c) => Object.isFrozen(c) && Object.isFrozen(c.factors))).toBe(true);
    expect(() => {
      (shared[0].factors as { D: number }).D = 9;
    }).toThrow(TypeError);
    // ASCE 7-16 §2.3.1 (recalled): 1.2D + 1.6L + 0.5S is among the LRFD combinations of D, L and S.
    expect(shared.some((c) => c.factors.D === 1.2 && c.factors.L === 1.6 && c.factors.S === 0.5)).toBe(true);
  });
});
