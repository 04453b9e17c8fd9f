/**
 * Typical levels (shared/engine/scheme/typical-levels.scheme.ts): levels alike are designed once
 * and the result placed on each. The result must be the same text, byte for byte, as designing
 * the whole plan at once (`typicalLevels: false`): every number, key order, id and load source.
 * Plans are invented of our own.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Plan, PlanMember } from '../../../shared/schemas/plan.schema';
import { designScheme, designedFromLevelTemplates } from '../../../shared/engine/scheme/design-scheme.scheme';
import { realText, typicalLevelTemplates } from '../../../shared/engine/scheme/typical-levels.scheme';
import { regularBuildingPlan } from '../../bench/plan.bench';
import { buildDemoBuildingPlan } from '../../../server/db/demo-building.builder';
import { DEMO_SCHEMES } from '../../../server/db/seed-demo-building';

const both = (plan: Plan, options: Parameters<typeof designScheme>[1] = {}) => {
  const templated = designScheme(plan, options);
  const whole = designScheme(plan, { ...options, typicalLevels: false });
  return { templated, whole, same: JSON.stringify(templated) === JSON.stringify(whole) };
};

describe('typical levels: designed once, placed on each level, identical to designing the plan at once', () => {
  it('when the 6-level benchmark building is designed, then 5 alike levels share one template and the text is identical', () => {
    const plan = regularBuildingPlan(6, 4, 3);
    const templates = typicalLevelTemplates(plan)!;
    expect(templates.map((t) => t.levels.length).sort()).toEqual([1, 5]);
    const r = both(plan);
    expect(designedFromLevelTemplates(r.templated)).toBe(true);
    expect(designedFromLevelTemplates(r.whole)).toBe(false);
    expect(r.same).toBe(true);
    // Real ids everywhere: nothing of a placeholder reaches the result.
    expect(JSON.stringify(r.templated)).not.toMatch(/[\uE000\uE001]/);
    expect(r.templated.members.filter((m) => m.level === 'L4').map((m) => m.id)).toContain('L4-B3-1');
  });

  it('when grouping of identical members is on, then the templated design is still identical', () => {
    const r = both(regularBuildingPlan(4, 4, 3), { groupIdentical: true });
    expect(designedFromLevelTemplates(r.templated)).toBe(true);
    expect(r.same).toBe(true);
  });

  it('when a demo scheme (composite) gets a copy of one of its floors as another storey, then the two share a template and the text is identical', () => {
    for (const scheme of DEMO_SCHEMES) {
      const plan = buildDemoBuildingPlan({ name: scheme.name, beamSpacing_ft: scheme.beamSpacing_ft });
      expect(typicalLevelTemplates(plan)).toBeNull(); // no two demo floors are alike
      const source = plan.levels.find((l) => !l.roof && plan.members.some((m) => m.level === l.id && m.composite !== false))!;
      const copyId = `${source.id}-copy`;
      plan.levels.push({ id: copyId, name: 'Copied storey', elevation_ft: Math.max(...plan.levels.map((l) => l.elevation_ft)) + 13 });
      const copy = <T extends { id?: string; level: string }>(list: T[]) => list.filter((e) => e.level === source.id).map((e) => ({ ...structuredClone(e), id: `${e.id}~c`, level: copyId }));
      plan.members.push(...copy(plan.members));
      plan.decks.push(...copy(plan.decks));
      plan.openings.push(...copy(plan.openings));
      plan.pointLoads.push(...copy(plan.pointLoads));
      plan.lineLoads.push(...copy(plan.lineLoads));
      for (const c of plan.columns) if (c.levels.includes(source.id)) c.levels.push(copyId);
      const templates = typicalLevelTemplates(plan)!;
      expect(templates.some((t) => t.levels.map((l) => l.levelId).join() === `${source.id},${copyId}`)).toBe(true);
      const r = both(plan);
      expect(designedFromLevelTemplates(r.templated)).toBe(true);
      expect(r.same).toBe(true);
      const copied = r.templated.members.filter((m) => m.level === copyId);
      expect(copied.some((m) => (m.studs ?? 0) > 0)).toBe(true);
      expect(copied.every((m) => m.id.endsWith('~c'))).toBe(true);
    }
  });

  it('when member loads are not asked for (calc plan without --detail), then every member\'s list is empty and all else is the same text, templated or not', () => {
    const plan = regularBuildingPlan(4, 4, 3);
    const full = designScheme(plan);
    const withoutLoads = (r: ReturnType<typeof designScheme>) => JSON.stringify({ ...r, members: r.members.map((m) => ({ ...m, loads: [] })) });
    for (const typicalLevels of [true, false]) {
      const lean = designScheme(plan, { memberLoads: false, typicalLevels });
      expect(designedFromLevelTemplates(lean)).toBe(typicalLevels);
      expect(lean.members.every((m) => m.loads.length === 0)).toBe(true);
      expect(JSON.stringify(lean)).toBe(withoutLoads(full));
    }
    expect(full.members.every((m) => m.loads.length > 0)).toBe(true);
  });

  it('when a re-design passes the previous templated result, then it equals a fresh design', () => {
    const plan = regularBuildingPlan(4, 4, 3);
    const first = designScheme(plan);
    const changed = structuredClone(plan);
    changed.members.find((m) => m.id === 'L3-B5-1')!.shape = 'W21X50';
    expect(designedFromLevelTemplates(first)).toBe(true);
    const again = designScheme(changed, { previous: first, changedIds: ['L3-B5-1'] });
    expect(JSON.stringify(again)).toBe(JSON.stringify(designScheme(changed, { typicalLevels: false })));
    expect(again.members.find((m) => m.id === 'L3-B5-1')!.shape).toBe('W21X50');
  });

  it('when one of the alike levels has a problem (a beam end on nothing), then the plan is designed at once and the problem is reported as before', () => {
    const plan = regularBuildingPlan(4, 4, 3);
    plan.members.push({ id: 'L3-stray', level: 'L3', kind: 'beam', start: [5, 5], end: [5, 25], shape: null, maxDepth_in: null });
    plan.members.push({ id: 'L4-stray', level: 'L4', kind: 'beam', start: [5, 5], end: [5, 25], shape: null, maxDepth_in: null });
    expect(typicalLevelTemplates(plan)).not.toBeNull();
    const r = both(plan);
    expect(designedFromLevelTemplates(r.templated)).toBe(false);
    expect(r.same).toBe(true);
    expect(r.templated.problems.some((p) => p.elementId === 'L3-stray')).toBe(true);
  });

  it('when an id holds the placeholder characters, then no template is made and the design is the same', () => {
    const plan = regularBuildingPlan(3, 2, 2);
    plan.members[0].id = 'L2-\uE0000000001\uE001';
    expect(typicalLevelTemplates(plan)).toBeNull();
    expect(both(plan).same).toBe(true);
  });

  it('when no two levels are alike (a zone differs), then no template is made', () => {
    const plan = regularBuildingPlan(3, 2, 2);
    plan.decks.find((d) => d.level === 'L3' && d.zone === 'office')!.zone = 'corridor';
    expect(typicalLevelTemplates(plan)).toBeNull();
  });

  it('when ids sort differently on two otherwise alike levels, then they get different templates (ties are broken by id)', () => {
    const plan = regularBuildingPlan(3, 2, 2);
    // Reverse the rank order of L3's member ids only.
    const l3 = plan.members.filter((m) => m.level === 'L3');
    const names = l3.map((m) => m.id).sort().reverse();
    const renamed = new Map(l3.map((m, i) => [m.id, `L3-z${String(i).padStart(3, '0')}-${names[i]}`]));
    for (const m of l3) m.id = renamed.get(m.id)!;
    const templates = typicalLevelTemplates(plan);
    expect(templates === null || templates.every((t) => t.levels.length === 1 || !t.levels.some((l) => l.levelId === 'L3'))).toBe(true);
    expect(both(plan).same).toBe(true);
  });

  it('restores real ids in text written with placeholders', () => {
    const level = { levelId: 'Level 7', ids: ['a', 'b-2', 'c'] };
    expect(realText('beam \uE0000000001\uE001 reaction on \uE000L\uE001', level)).toBe('beam b-2 reaction on Level 7');
    expect(realText('no ids here', level)).toBe('no ids here');
  });

  it('property: random alike levels (random ids, file order interleaved, loads, locked sizes) design identically either way', () => {
    const idChars = fc.constantFrom('a', 'B', '7', '-', '_', 'é', ' ', 'z', '0');
    const levelSpec = fc.record({
      bays: fc.integer({ min: 1, max: 3 }),
      beams: fc.integer({ min: 2, max: 5 }),
      point: fc.option(fc.record({ x: fc.double({ min: 1, max: 29, noNaN: true }), y: fc.double({ min: 1, max: 29, noNaN: true }), D: fc.integer({ min: 1, max: 9 }) }), { nil: null }),
      locked: fc.boolean(),
      copies: fc.integer({ min: 2, max: 4 }),
      prefix: fc.array(fc.string({ unit: idChars, minLength: 1, maxLength: 4 }), { minLength: 4, maxLength: 4 }),
      shuffle: fc.integer({ min: 0, max: 1000 }),
      // Level names: numbered, none (the mark prefix falls back to the id), lettered alike
      // (every level's prefix "N"), numbered alike ("Level 3" twice); marks: none, or one
      // beam per level carrying an issued or a locked mark.
      naming: fc.constantFrom('numbered', 'empty', 'letter', 'same-number'),
      marks: fc.constantFrom('none', 'none', 'issued', 'locked'),
    });
    let templatedRuns = 0;
    fc.assert(
      fc.property(levelSpec, (spec) => {
        const name = (i: number) => ({ numbered: `Level ${i + 2}`, empty: '', letter: 'North wing', 'same-number': i < 2 ? 'Level 3' : `Level ${i + 2}` })[spec.naming];
        const levels = Array.from({ length: spec.copies }, (_, i) => ({ id: `${spec.prefix[i % 4]}#${i}`, name: name(i), elevation_ft: 13 * (i + 1) }));
        const W = 30 * spec.bays;
        const plan: Plan = {
          format: 'baywright-plan', version: 2, name: 'property',
          designBasis: { method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 } },
          levels,
          columns: [],
          members: [],
          zones: [{ id: 'office', name: 'Office', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 15, live_psf: 50, liveReducible: true, roofLive_psf: 0, snow_psf: 0 }],
          decks: [], pointLoads: [], lineLoads: [], openings: [],
        };
        for (let i = 0; i <= spec.bays; i++) for (const y of [0, 30]) plan.columns.push({ id: `C${i}/${y}`, x_ft: 30 * i, y_ft: y, levels: levels.map((l) => l.id) });
        const members: PlanMember[] = [];
        levels.forEach((level, li) => {
          const id = (s: string) => `${level.id}${s}`;
          for (let i = 0; i < spec.bays; i++) for (const y of [0, 30]) members.push({ id: id(`G${i}.${y}`), level: level.id, kind: 'girder', start: [30 * i, y], end: [30 * (i + 1), y], shape: null, maxDepth_in: null });
          for (let k = 0; k <= spec.beams * spec.bays; k++) {
            const x = (k * 30) / spec.beams;
            members.push({ id: id(`B${k}`), level: level.id, kind: 'beam', start: [x, 0], end: [x, 30], shape: spec.locked && k === 1 ? 'W16X31' : null, maxDepth_in: null });
            if (k === 2 && spec.marks !== 'none') Object.assign(members[members.length - 1], { mark: 'B7', markLocked: spec.marks === 'locked' });
          }
          plan.decks.push({ id: id('d'), level: level.id, polygon: [[0, 0], [W, 0], [W, 30], [0, 30]], spanDirection: 'x', zone: 'office' });
          if (spec.point) plan.pointLoads.push({ id: id('p'), level: level.id, x_ft: Math.min(spec.point.x, W - 1), y_ft: spec.point.y, D_kip: spec.point.D, L_kip: 1 });
          void li;
        });
        // Interleave the levels' members in the file (a deterministic merge that keeps each
        // level's own order: file order within a level is part of what makes levels alike).
        const queues = levels.map((l) => members.filter((m) => m.level === l.id));
        const merged: PlanMember[] = [];
        let seed = spec.shuffle;
        while (merged.length < members.length) {
          seed = (seed * 1103515245 + 12345) % 2147483648;
          const open = queues.filter((q) => q.length > 0);
          merged.push(open[seed % open.length].shift()!);
        }
        plan.members = merged;
        const r = both(plan);
        expect(r.same).toBe(true);
        if (designedFromLevelTemplates(r.templated)) templatedRuns++;
        return true;
      }),
      { numRuns: 25, seed: 20261203 },
    );
    // Most generated plans are templated (the rest fall back, e.g. a load off the floor): both paths are exercised.
    expect(templatedRuns).toBeGreaterThan(5);
  });
});

describe('typical levels: marks', () => {
  it('when the 24-level benchmark building is designed, then each level\'s marks carry its own prefix, as marking the whole plan at once gives', () => {
    const plan = regularBuildingPlan(24, 4, 3);
    const r = both(plan);
    expect(designedFromLevelTemplates(r.templated)).toBe(true);
    expect(r.same).toBe(true);
    const marksOn = (level: string) => r.templated.members.filter((m) => m.level === level).map((m) => m.mark);
    // "Level 5" → prefix 5, "Level 25" (the roof, named by number) → 25 (member-marks.scheme levelMarkPrefix).
    expect(new Set(marksOn('L5').map((m) => m.replace(/[GB]\d+$/, '')))).toEqual(new Set(['5']));
    expect(marksOn('L5').map((m) => m.slice(1))).toEqual(marksOn('L6').map((m) => m.slice(1)));
    expect(marksOn('L25').every((m) => m.startsWith('25'))).toBe(true);
  });
});

describe('typical levels: a re-design keeps the placed members that come out the same', () => {
  const sameObjects = (before: ReturnType<typeof designScheme>, after: ReturnType<typeof designScheme>) => {
    const byId = new Map(before.members.map((m) => [m.id, m]));
    return after.members.filter((m) => byId.get(m.id) === m);
  };

  it('when one beam on one of five alike floors is locked to another size, then every member of the other floors is the earlier object, that floor\'s are new, and the text is a fresh design\'s', () => {
    const plan = regularBuildingPlan(6, 4, 3);
    const first = designScheme(plan);
    const changed = structuredClone(plan);
    changed.members.find((m) => m.id === 'L4-B5-1')!.shape = 'W24X55';
    const again = designScheme(changed, { previous: first });
    expect(JSON.stringify(again)).toBe(JSON.stringify(designScheme(changed, { typicalLevels: false })));
    const kept = sameObjects(first, again);
    // L4 is no longer like the others, so it is a template of its own with nothing earlier to keep.
    expect(kept.some((m) => m.level === 'L4')).toBe(false);
    expect(kept.length).toBe(again.members.filter((m) => m.level !== 'L4').length);
    // The same plan again: every member is kept.
    expect(sameObjects(again, designScheme(changed, { previous: again })).length).toBe(again.members.length);
  });

  it('property: over any chain of edits (sizes, level names, loads, ids renamed, member loads on or off), each re-design reads as a fresh design', () => {
    type Edit =
      | { kind: 'size'; level: number; beam: number; shape: string | null }
      | { kind: 'name'; level: number; name: string }
      | { kind: 'point'; level: number; D: number }
      | { kind: 'rename'; level: number }
      | { kind: 'loads'; on: boolean };
    const edit: fc.Arbitrary<Edit> = fc.oneof(
      fc.record({ kind: fc.constant('size' as const), level: fc.integer({ min: 0, max: 3 }), beam: fc.integer({ min: 0, max: 12 }), shape: fc.constantFrom(null, 'W16X31', 'W21X50') }),
      fc.record({ kind: fc.constant('name' as const), level: fc.integer({ min: 0, max: 3 }), name: fc.constantFrom('Level 9', 'Mezzanine', '') }),
      fc.record({ kind: fc.constant('point' as const), level: fc.integer({ min: 0, max: 3 }), D: fc.integer({ min: 1, max: 8 }) }),
      fc.record({ kind: fc.constant('rename' as const), level: fc.integer({ min: 0, max: 3 }) }),
      fc.record({ kind: fc.constant('loads' as const), on: fc.boolean() }),
    );
    let keptAny = 0;
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 5 }), (edits) => {
        let plan = regularBuildingPlan(5, 4, 3);
        let memberLoads = true;
        let last = designScheme(plan);
        for (const e of edits) {
          plan = structuredClone(plan);
          const level = plan.levels[e.kind === 'loads' ? 0 : e.level];
          if (e.kind === 'size') plan.members.filter((m) => m.level === level.id && m.kind === 'beam')[e.beam].shape = e.shape;
          else if (e.kind === 'name') level.name = e.name;
          else if (e.kind === 'point') plan.pointLoads.push({ id: `${level.id}-extra${plan.pointLoads.length}`, level: level.id, x_ft: 20, y_ft: 14, D_kip: e.D, L_kip: 1 });
          else if (e.kind === 'rename') {
            // The level's ids renamed in the same order (the level stays alike; its renaming differs).
            for (const list of [plan.members, plan.decks, plan.pointLoads, plan.lineLoads, plan.openings] as { id?: string; level: string }[][]) {
              for (const el of list) if (el.level === level.id) el.id = `${el.id}r`;
            }
          } else memberLoads = e.on;
          const next = designScheme(plan, { previous: last, memberLoads });
          expect(JSON.stringify(next)).toBe(JSON.stringify(designScheme(plan, { memberLoads, typicalLevels: false })));
          keptAny += sameObjects(last, next).length;
          last = next;
        }
        return true;
      }),
      { numRuns: 20, seed: 20261203 },
    );
    expect(keptAny).toBeGreaterThan(0); // the reuse path was taken
  });
});
