import { planNamer } from '../../../../shared/drafting/element-names.drafting';
/**
 * The committed drawing of one level, prepared once per plan/design change and cached:
 * members grouped into one path per (kind, utilisation band) so thousands of members stroke
 * in a handful of calls. Paths are in plan feet; the view transform is applied when drawn.
 */
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { SchemeMember } from '../../../../shared/engine/index';
import type { LiveDesignSnapshot } from '../design/live-design';
import { memberStatus, type MemberStatus } from '../members/member-status';
import type { UtilisationBand } from '../../../lib/utilisation';
import type { PlanPoint } from '../store/editor.types';
import { gridIntersectionLabeller } from '../../../../shared/drafting/grid-location.drafting';
import { factoredReaction } from '../../../../shared/drafting/schedule.drafting';

type SchemeReactionEnd = SchemeMember['reactions']['start'];

export interface MemberLabel {
  id: string;
  kind: 'girder' | 'beam';
  start: PlanPoint;
  end: PlanPoint;
  status: MemberStatus;
}

export interface StaticGeometry {
  members: { kind: 'girder' | 'beam'; band: UtilisationBand; path: Path2D; count: number }[];
  labels: MemberLabel[];
  decks: { id: string; polygon: PlanPoint[]; spanDirection: 'x' | 'y'; zoneIndex: number; zoneName: string }[];
  openings: { id: string; polygon: PlanPoint[] }[];
  columns: PlanPoint[];
  /** Column mark (grid intersection or id) and the size of its length below this level, where designed. */
  columnLabels: { at: PlanPoint; text: string }[];
  /** Loads in plan units (kip, klf); their labels are written in the reader's units when drawn. */
  pointLoads: { id: string; at: PlanPoint; D_kip: number; L_kip: number }[];
  lineLoads: { id: string; start: PlanPoint; end: PlanPoint; D_klf: number; L_klf: number }[];
  /**
   * End reactions of each designed member, kip: LRFD factored or ASD service, the governing
   * ASCE 7-16 combination of its unfactored D, L (reduced), Lr and S (as the plan sheet prints).
   */
  reactions: { id: string; start: PlanPoint; end: PlanPoint; startKip: number; endKip: number }[];
  /** Design method the reactions are for (null before the first design). */
  reactionMethod: 'LRFD' | 'ASD' | null;
  memberCount: number;
}

function columnLabels(plan: Plan, levelId: string, design: LiveDesignSnapshot): { at: PlanPoint; text: string }[] {
  const designed = new Map((design.result?.columns ?? []).map((c) => [c.id, c]));
  const out: { at: PlanPoint; text: string }[] = [];
  const gridMark = gridIntersectionLabeller(plan.grids);
  for (const c of plan.columns) {
    if (!c.levels.includes(levelId)) continue;
    const mark = gridMark(c.x_ft, c.y_ft) ?? c.id;
    const shape = designed.get(c.id)?.levels?.find((l) => l.level === levelId)?.shape;
    out.push({ at: [c.x_ft, c.y_ft], text: shape ? `${mark} ${shape}` : mark });
  }
  return out;
}

export function buildStaticGeometry(plan: Plan, levelId: string, design: LiveDesignSnapshot): StaticGeometry {
  const groups = new Map<string, { kind: 'girder' | 'beam'; band: UtilisationBand; path: Path2D; count: number }>();
  const labels: MemberLabel[] = [];
  const names = planNamer(plan, new Map((design.result?.members ?? []).map((x) => [x.id, x.mark])));
  for (const m of plan.members) {
    if (m.level !== levelId) continue;
    const status = memberStatus(m.id, design.byId.get(m.id), design.result, design.pending, names);
    const band = status.util.band;
    const key = `${m.kind}:${band}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { kind: m.kind, band, path: new Path2D(), count: 0 }));
    g.path.moveTo(m.start[0], m.start[1]);
    g.path.lineTo(m.end[0], m.end[1]);
    g.count++;
    labels.push({ id: m.id, kind: m.kind, start: m.start, end: m.end, status });
  }
  const method = design.result?.method === 'ASD' ? 'ASD' : 'LRFD';
  const reactions: StaticGeometry['reactions'] = [];
  for (const m of plan.members) {
    if (m.level !== levelId) continue;
    const dm = design.byId.get(m.id);
    if (!dm || !dm.design) continue;
    const f = (r: SchemeReactionEnd) => factoredReaction(method, { D_kip: r.D_kip, L_kip: r.L_kip, Lr_kip: r.Lr_kip ?? 0, S_kip: r.S_kip ?? 0 }).factored_kip;
    reactions.push({ id: m.id, start: m.start, end: m.end, startKip: f(dm.reactions.start), endKip: f(dm.reactions.end) });
  }
  const zoneIndex = new Map(plan.zones.map((z, i) => [z.id, i]));
  // Beams first so girders draw over them.
  const members = [...groups.values()].sort((a, b) => (a.kind === b.kind ? 0 : a.kind === 'beam' ? -1 : 1));
  return {
    members,
    labels,
    decks: plan.decks.filter((d) => d.level === levelId).map((d) => ({ id: d.id, polygon: d.polygon, spanDirection: d.spanDirection, zoneIndex: zoneIndex.get(d.zone) ?? -1, zoneName: plan.zones.find((z) => z.id === d.zone)?.name ?? d.zone })),
    openings: plan.openings.filter((o) => o.level === levelId).map((o) => ({ id: o.id, polygon: o.polygon })),
    columns: plan.columns.filter((c) => c.levels.includes(levelId)).map((c) => [c.x_ft, c.y_ft] as PlanPoint),
    columnLabels: columnLabels(plan, levelId, design),
    pointLoads: plan.pointLoads.filter((p) => p.level === levelId).map((p) => ({ id: p.id, at: [p.x_ft, p.y_ft] as PlanPoint, D_kip: p.D_kip, L_kip: p.L_kip })),
    lineLoads: plan.lineLoads.filter((w) => w.level === levelId).map((w) => ({ id: w.id, start: w.start, end: w.end, D_klf: w.D_klf, L_klf: w.L_klf })),
    reactions,
    reactionMethod: design.result ? method : null,
    memberCount: labels.length,
  };
}
