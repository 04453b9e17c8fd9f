/**
 * What people call the elements of a plan, for every sentence a person reads: members by kind,
 * mark and grid location ("beam 2B1 at B–C / 2"), levels and zones by name, loads by where they
 * are. Engine problems and load sources carry element ids (they are stable keys for tools);
 * these helpers rewrite them at the edge. Pure.
 */
import type { Plan } from '../schemas/plan.schema';
import { gridIntersectionLabel, gridLocation } from './grid-location.drafting';
import type { SourceNames } from './load-source.drafting';

export interface PlanNamer extends SourceNames {
  member(id: string): string | undefined;
  level(id: string): string | undefined;
  zone(id: string): string | undefined;
  load(id: string): string | undefined;
}

/** Names from a plan and the marks of its design (member id → mark). */
export function planNamer(plan: Plan, marks: ReadonlyMap<string, string> = new Map()): PlanNamer {
  const members = new Map(plan.members.map((m) => [m.id, m]));
  const levels = new Map(plan.levels.map((l) => [l.id, l.name]));
  const zones = new Map(plan.zones.map((z) => [z.id, z.name]));
  const loads = new Map<string, [number, number]>([
    ...plan.pointLoads.map((p) => [p.id, [p.x_ft, p.y_ft]] as [string, [number, number]]),
    ...plan.lineLoads.map((w) => [w.id, [(w.start[0] + w.end[0]) / 2, (w.start[1] + w.end[1]) / 2]] as [string, [number, number]]),
  ]);
  return {
    member(id) {
      const m = members.get(id);
      if (!m) return undefined;
      const mark = marks.get(id) || (m.mark ?? '');
      const where = gridLocation(m.start, m.end, plan.grids);
      return `${m.kind}${mark ? ` ${mark}` : ''}${where ? ` at ${where}` : ''}`;
    },
    level: (id) => levels.get(id),
    zone: (id) => zones.get(id),
    load(id) {
      const at = loads.get(id);
      if (!at) return undefined;
      const label = gridIntersectionLabel(at[0], at[1], plan.grids);
      return label ? `at ${label}` : `at (${at[0].toFixed(1)}, ${at[1].toFixed(1)}) ft`;
    },
  };
}

/**
 * A problem sentence with the ids it names replaced by names: "Member b4: …" → "Beam 2B3 at
 * B–C / 2: …", "member g2" → "girder 2G1 at …", "level L2" → "Level 2", "deck d3" → "the
 * Office deck". Ids with no name are left as they are.
 */
export function describeProblem(message: string, names: PlanNamer): string {
  let out = message.replace(/^Member (\S+?):/, (all, id) => {
    const n = names.member(id);
    return n ? `${n[0].toUpperCase()}${n.slice(1)}:` : all;
  });
  out = out.replace(/\bmembers? (\S+?)(?=[\s,;:)]|$)/g, (all, id) => names.member(id) ?? all);
  out = out.replace(/\b(at |on )?level (\S+?)(?=[\s,;:)]|$)/g, (all, pre, id) => {
    const n = names.level(id);
    return n ? `${pre ?? ''}${n}` : all;
  });
  return out;
}
