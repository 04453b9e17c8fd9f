/**
 * The scheme reuses a column design wherever a column's input (lengths, tiers, loads, basis) is
 * exactly the same (scheme/column-design.scheme.ts). These tests check that reuse never carries
 * one plan's column sizes into another: each plan's columns are the same whichever plans were
 * designed before it, and a load change reaches the column sizes.
 */
import { describe, expect, it } from 'vitest';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import type { Plan } from '../../../shared/schemas/plan.schema';
import { regularBuildingPlan } from '../../bench/plan.bench';

/** An invented three-storey building of our own: 3 × 2 bays of 30 ft (the benchmark's layout). */
const goldenBuildingPlan = () => regularBuildingPlan(3, 3, 2);

const columnsText = (p: Plan) => JSON.stringify(designScheme(p).columns);

describe('column designs reused by their input', () => {
  it('when two plans differing in live load are designed in either order, then each gets the same columns both times and they differ', () => {
    const light = goldenBuildingPlan();
    const heavy = structuredClone(light);
    // Invented scenario: office live load raised from 50 to 150 psf (not reducible past 100 psf, ASCE 7-16 §4.7.3).
    heavy.zones.find((z) => z.id === 'office')!.live_psf = 150;
    const lightFirst = columnsText(light);
    const heavyAfterLight = columnsText(heavy);
    const lightAgain = columnsText(light);
    const heavyAgain = columnsText(heavy);
    expect(lightAgain).toBe(lightFirst);
    expect(heavyAgain).toBe(heavyAfterLight);
    expect(heavyAfterLight).not.toBe(lightFirst);
    // The heavier floor needs at least as much column steel in total, and more somewhere.
    const weight = (p: Plan) => designScheme(p).totals.columnWeight_lb;
    expect(weight(heavy)).toBeGreaterThan(weight(light));
  }, 60_000);

  it('when a re-design after a load edit is passed the previous result, then its columns equal a full design of the edited plan', () => {
    const base = goldenBuildingPlan();
    const first = designScheme(base);
    const edited = structuredClone(base);
    // Invented scenario: the façade line load on the lowest floor raised from 0.4 to 2.0 klf.
    edited.lineLoads[0].D_klf = 2.0;
    const incremental = designScheme(edited, { previous: first });
    expect(JSON.stringify(incremental.columns)).toBe(JSON.stringify(designScheme(structuredClone(edited)).columns));
    expect(JSON.stringify(incremental.columns)).not.toBe(JSON.stringify(first.columns));
  }, 60_000);
});
