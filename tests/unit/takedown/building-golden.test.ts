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

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

describe('benchmark building: output identical to before the performance work', () => {
  it('when the 24-level building is taken down and designed, then both JSON texts hash as recorded', () => {
    const plan = regularBuildingPlan(24, 10, 8);
    const td = runTakedown(plan);
    const takedownText = JSON.stringify({ order: td.order, members: [...td.members.values()], columns: td.columns, equilibrium: td.equilibrium, problems: td.problems });
    expect(sha256(takedownText)).toBe('b198f5ba6221f86fb3f4f2b5355776e4ca2693c5e30abd3e89ff4dd87666c769');
    const design = designScheme(plan);
    expect(design.members).toHaveLength(10032);
    expect(sha256(JSON.stringify(design))).toBe('dd17c71120c30be78b8a3d8663c436a4269e0a91151ef8fa008f4f982deaf460');
  }, 120_000);
});
