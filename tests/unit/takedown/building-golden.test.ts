/**
 * Golden digest of the benchmark building (24 levels, 10,032 members): the SHA-256 of the JSON
 * text of its takedown and of its whole-scheme design, recorded at 14b1741 before the
 * performance work on the engine. Any change to a number, a key order or a text fails here.
 */
import { describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { regularBuildingPlan } from '../../bench/plan.bench';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import { runTakedown } from '../../../shared/engine/takedown/gravity-takedown.takedown';
import { buildDemoBuildingPlan } from '../../../server/db/demo-building.builder';

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

describe('benchmark building: output identical to before the performance work', () => {
  it('when the 24-level building is taken down and designed, then both JSON texts hash as recorded', () => {
    const plan = regularBuildingPlan(24, 10, 8);
    const td = runTakedown(plan);
    const takedownText = JSON.stringify({ order: td.order, members: [...td.members.values()], columns: td.columns, equilibrium: td.equilibrium, problems: td.problems });
    expect(sha256(takedownText)).toBe('b198f5ba6221f86fb3f4f2b5355776e4ca2693c5e30abd3e89ff4dd87666c769');
    const design = designScheme(plan);
    expect(design.members).toHaveLength(10032);
    // Members and equilibrium: unchanged since 14b1741 (before the performance work).
    expect(sha256(JSON.stringify(design.members))).toBe('42dedd275bfe6a089d883f80112ef43a429fd0d0a4a55a5c614cc9c3a6aafedc');
    expect(sha256(JSON.stringify(design.equilibrium))).toBe('0f966c35809dd66789fc04eda59cec0ba5ea92d1510243e53f957bb756f53132');
    // The whole document, re-recorded when columns were sized by tier (issue 12 adds their sizes and
    // totals.columnWeight_lb), and again when sizing took Lc/r ≤ 200 as a limit (AISC 360-16 E2 User
    // Note): every size, ratio and total stayed the same; only a tier's "next lighter shape" changed
    // where the one before it was over Lc/r 200.
    expect(sha256(JSON.stringify(design))).toBe('b5409e100a447c312ac7c29bf4e6e5b94c5089856954c66a5d594ea0c0efd0cd');
  }, 120_000);

  // The demo schemes, designed composite (slab on 3 in. deck, studs, camber, the wet stage, one
  // member kept bare steel): recorded when the parallel-rib concrete block was corrected
  // (AISC 360-16 I3.2c; no demo member's block reaches below the topping, so no size changed).
  const demoSchemes = [
    { name: 'Scheme A — beams at about 10 ft', beamSpacing_ft: 10, expected: 'e1ab317e959109581b7958b23cb23df0097f04c17757a35055b5d99f90a20335' },
    { name: 'Scheme B — beams at about 7.5 ft', beamSpacing_ft: 7.5, expected: '75ded178f8af79f0bb793780c63d5d522c4dcddcbd0705c222c5c9afac402165' },
  ];
  for (const { expected, ...scheme } of demoSchemes) {
    it(`when the demo "${scheme.name}" is designed composite, then its JSON text hashes as recorded`, () => {
      const design = designScheme(buildDemoBuildingPlan({ name: scheme.name, beamSpacing_ft: scheme.beamSpacing_ft }));
      expect(design.members.filter((m) => m.studs !== null && m.studs !== undefined && m.studs > 0).length).toBeGreaterThan(100);
      expect(sha256(JSON.stringify(design))).toBe(expected);
    }, 60_000);
  }
});
