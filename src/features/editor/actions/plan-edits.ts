/**
 * Pure edits of a plan: each takes a plan and returns a new one (records are never mutated,
 * so undo keeps the old plan as it was and unchanged elements keep their identity).
 */
import type { Plan, PlanDeck, PlanGrid, PlanMember, PlanZone } from '../../../../shared/schemas/plan.schema';
import type { PlanPoint } from '../store/editor.types';
import { nextId, usedIds } from '../store/plan-ids';
import { gridLabel, offsetsFromSpacings } from '../tools/grid-spacings.parser';
import { gridIntersections } from '../tools/snapping.tool';
import { distance, samePoint } from '../tools/plan-geometry';
import type { InfillResult } from '../tools/infill.tool';
import type { ZonePreset } from '../tools/zone-presets';

export class EditError extends Error {}

const pt = (p: PlanPoint): [number, number] => [p[0], p[1]];

/** Relabel one axis by position: x lines 1, 2, 3 … west to east; y lines A, B … south to north. */
function relabel(grids: PlanGrid[]): PlanGrid[] {
  const out: PlanGrid[] = [];
  for (const axis of ['x', 'y'] as const) {
    grids
      .filter((g) => g.axis === axis)
      .sort((a, b) => a.offset_ft - b.offset_ft)
      .forEach((g, i) => {
        const label = gridLabel(axis, i);
        out.push(g.label === label ? g : { ...g, label });
      });
  }
  return out;
}

/** Replace the grid lines of an axis with lines at these spacings from the origin. */
export function setGridFromSpacings(plan: Plan, axis: 'x' | 'y', spacings_ft: readonly number[], origin_ft = 0): Plan {
  const taken = usedIds(plan);
  const kept = (plan.grids ?? []).filter((g) => g.axis !== axis);
  // Existing lines keep their ids in order (the grid moved rather than was replaced).
  const existing = (plan.grids ?? []).filter((g) => g.axis === axis).sort((a, b) => a.offset_ft - b.offset_ft);
  const lines = offsetsFromSpacings(spacings_ft, origin_ft).map((offset_ft, i): PlanGrid => {
    const old = existing[i];
    if (old) return old.offset_ft === offset_ft ? old : { ...old, offset_ft };
    return { id: nextId(plan, `grid-${axis}`, taken), axis, label: '', offset_ft };
  });
  return { ...plan, grids: relabel([...kept, ...lines]) };
}

export function addGridLine(plan: Plan, axis: 'x' | 'y', offset_ft: number): Plan {
  if ((plan.grids ?? []).some((g) => g.axis === axis && Math.abs(g.offset_ft - offset_ft) < 0.01)) return plan;
  const grid: PlanGrid = { id: nextId(plan, `grid-${axis}`), axis, label: '', offset_ft };
  return { ...plan, grids: relabel([...(plan.grids ?? []), grid]) };
}

export function moveGridLine(plan: Plan, gridId: string, offset_ft: number): Plan {
  if (!Number.isFinite(offset_ft)) throw new EditError('Grid line offset: enter a number of feet.');
  return { ...plan, grids: relabel((plan.grids ?? []).map((g) => (g.id === gridId ? { ...g, offset_ft } : g))) };
}

/** A column here at these levels (or those levels added to a column already here). */
export function addColumn(plan: Plan, at: PlanPoint, levelIds: string[]): Plan {
  const existing = plan.columns.find((c) => samePoint([c.x_ft, c.y_ft], at));
  if (existing) {
    const levels = [...new Set([...existing.levels, ...levelIds])];
    if (levels.length === existing.levels.length) return plan;
    return { ...plan, columns: plan.columns.map((c) => (c === existing ? { ...c, levels } : c)) };
  }
  return { ...plan, columns: [...plan.columns, { id: nextId(plan, 'C'), x_ft: at[0], y_ft: at[1], levels: [...levelIds] }] };
}

export function columnsAtAllIntersections(plan: Plan, levelIds: string[]): Plan {
  let next = plan;
  for (const p of gridIntersections(plan)) next = addColumn(next, p, levelIds);
  return next;
}

export function addMember(plan: Plan, levelId: string, kind: 'girder' | 'beam', start: PlanPoint, end: PlanPoint): { plan: Plan; id: string } {
  if (distance(start, end) < 0.5) throw new EditError(`A ${kind} must be at least 0.5 ft long.`);
  const duplicate = plan.members.find(
    (m) => m.level === levelId && ((samePoint(m.start, start) && samePoint(m.end, end)) || (samePoint(m.start, end) && samePoint(m.end, start))),
  );
  if (duplicate) throw new EditError(`Member ${duplicate.mark ?? duplicate.id} is already drawn there.`);
  const id = nextId(plan, kind === 'girder' ? 'g' : 'b');
  const member: PlanMember = { id, level: levelId, kind, start: pt(start), end: pt(end), shape: null, maxDepth_in: null };
  return { plan: { ...plan, members: [...plan.members, member] }, id };
}

export function moveMemberEnd(plan: Plan, memberId: string, which: 'start' | 'end', to: PlanPoint): Plan {
  return {
    ...plan,
    members: plan.members.map((m) => {
      if (m.id !== memberId) return m;
      const other = which === 'start' ? m.end : m.start;
      if (distance(other, to) < 0.5) return m;
      return { ...m, [which]: pt(to) };
    }),
  };
}

export function applyInfill(plan: Plan, result: Extract<InfillResult, { ok: true }>): Plan {
  const remove = new Set(result.removeIds);
  return { ...plan, members: [...plan.members.filter((m) => !remove.has(m.id)), ...result.add] };
}

/** The zone for this preset (by name and values), added to the plan when it is not there yet. */
export function ensureZone(plan: Plan, preset: ZonePreset['zone']): { plan: Plan; zoneId: string } {
  const same = plan.zones.find((z) => z.name === preset.name && sameLoads(z, preset));
  if (same) return { plan, zoneId: same.id };
  const base = preset.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'zone';
  const taken = usedIds(plan);
  const zoneId = taken.has(base) ? nextId(plan, `${base}-`, taken) : base;
  const zone: PlanZone = { id: zoneId, ...preset };
  return { plan: { ...plan, zones: [...plan.zones, zone] }, zoneId };
}

function sameLoads(a: Omit<PlanZone, 'id'>, b: Omit<PlanZone, 'id'>): boolean {
  return (['dead_psf', 'superimposedDead_psf', 'partition_psf', 'live_psf', 'roofLive_psf', 'snow_psf', 'liveReducible'] as const).every((k) => a[k] === b[k]);
}

export function addDeck(plan: Plan, levelId: string, polygon: readonly PlanPoint[], spanDirection: 'x' | 'y', zoneId: string): { plan: Plan; id: string } {
  if (polygon.length < 3) throw new EditError('A deck area needs at least three corners.');
  if (!plan.zones.some((z) => z.id === zoneId)) throw new EditError(`Deck: load zone “${zoneId}” is not in this scheme.`);
  const id = nextId(plan, 'd');
  const deck: PlanDeck = { id, level: levelId, polygon: polygon.map(pt), spanDirection, zone: zoneId };
  return { plan: { ...plan, decks: [...plan.decks, deck] }, id };
}

export function setDeck(plan: Plan, deckId: string, change: Partial<Pick<PlanDeck, 'zone' | 'spanDirection'>>): Plan {
  return { ...plan, decks: plan.decks.map((d) => (d.id === deckId ? { ...d, ...change } : d)) };
}

export function updateZone(plan: Plan, zoneId: string, change: Partial<Omit<PlanZone, 'id'>>): Plan {
  return { ...plan, zones: plan.zones.map((z) => (z.id === zoneId ? { ...z, ...change } : z)) };
}

export function addPointLoad(plan: Plan, levelId: string, at: PlanPoint, D_kip: number, L_kip: number): { plan: Plan; id: string } {
  const id = nextId(plan, 'P');
  return { plan: { ...plan, pointLoads: [...plan.pointLoads, { id, level: levelId, x_ft: at[0], y_ft: at[1], D_kip, L_kip }] }, id };
}

export function addLineLoad(plan: Plan, levelId: string, start: PlanPoint, end: PlanPoint, D_klf: number, L_klf: number): { plan: Plan; id: string } {
  if (distance(start, end) < 0.5) throw new EditError('A line load must be at least 0.5 ft long.');
  const id = nextId(plan, 'W');
  return { plan: { ...plan, lineLoads: [...plan.lineLoads, { id, level: levelId, start: pt(start), end: pt(end), D_klf, L_klf }] }, id };
}

export function addOpening(plan: Plan, levelId: string, polygon: readonly PlanPoint[]): { plan: Plan; id: string } {
  if (polygon.length < 3) throw new EditError('An opening needs at least three corners.');
  const id = nextId(plan, 'O');
  return { plan: { ...plan, openings: [...plan.openings, { id, level: levelId, polygon: polygon.map(pt) }] }, id };
}

export function updatePointLoad(plan: Plan, id: string, change: { D_kip?: number; L_kip?: number }): Plan {
  return { ...plan, pointLoads: plan.pointLoads.map((p) => (p.id === id ? { ...p, ...change } : p)) };
}

/** Remove elements by id; a column removed is removed at every level. Grids by id too. */
export function deleteElements(plan: Plan, ids: readonly string[]): Plan {
  const gone = new Set(ids);
  if (gone.size === 0) return plan;
  const keep = <T extends { id: string }>(list: T[]) => {
    const kept = list.filter((e) => !gone.has(e.id));
    return kept.length === list.length ? list : kept;
  };
  const grids = plan.grids ? keep(plan.grids) : plan.grids;
  return {
    ...plan,
    grids: grids === plan.grids ? grids : relabel(grids ?? []),
    columns: keep(plan.columns),
    members: keep(plan.members),
    decks: keep(plan.decks),
    pointLoads: keep(plan.pointLoads),
    lineLoads: keep(plan.lineLoads),
    openings: keep(plan.openings),
  };
}

export function addLevel(plan: Plan, name: string, elevation_ft: number): { plan: Plan; id: string } {
  if (name.trim() === '') throw new EditError('Level name: enter a name.');
  if (!Number.isFinite(elevation_ft)) throw new EditError('Level elevation: enter a number of feet.');
  const id = nextId(plan, 'L');
  const levels = [...plan.levels, { id, name: name.trim(), elevation_ft }].sort((a, b) => a.elevation_ft - b.elevation_ft);
  return { plan: { ...plan, levels }, id };
}

/**
 * Typical floors: the framing, deck, loads and openings of one level copied onto others,
 * replacing what those levels had; columns at the source level are carried to them too.
 */
export function copyLevel(plan: Plan, fromLevel: string, toLevels: readonly string[]): Plan {
  const targets = new Set(toLevels.filter((l) => l !== fromLevel && plan.levels.some((lv) => lv.id === l)));
  if (targets.size === 0) return plan;
  const taken = usedIds(plan);
  const onTarget = (e: { level: string }) => targets.has(e.level);
  const members = plan.members.filter((m) => !onTarget(m));
  const decks = plan.decks.filter((d) => !onTarget(d));
  const pointLoads = plan.pointLoads.filter((p) => !onTarget(p));
  const lineLoads = plan.lineLoads.filter((w) => !onTarget(w));
  const openings = plan.openings.filter((o) => !onTarget(o));
  for (const level of targets) {
    for (const m of plan.members) if (m.level === fromLevel) {
      // A copy is a new piece on its level: the design gives it that level's mark (3B1, not 2B1).
      const { mark: _mark, markLocked: _locked, ...rest } = m;
      members.push({ ...rest, id: nextId(plan, m.kind === 'girder' ? 'g' : 'b', taken), level });
    }
    for (const d of plan.decks) if (d.level === fromLevel) decks.push({ ...d, id: nextId(plan, 'd', taken), level });
    for (const p of plan.pointLoads) if (p.level === fromLevel) pointLoads.push({ ...p, id: nextId(plan, 'P', taken), level });
    for (const w of plan.lineLoads) if (w.level === fromLevel) lineLoads.push({ ...w, id: nextId(plan, 'W', taken), level });
    for (const o of plan.openings) if (o.level === fromLevel) openings.push({ ...o, id: nextId(plan, 'O', taken), level });
  }
  const columns = plan.columns.map((c) => (c.levels.includes(fromLevel) ? { ...c, levels: [...new Set([...c.levels, ...targets])] } : c));
  return { ...plan, members, decks, pointLoads, lineLoads, openings, columns };
}
