/**
 * The building as a 3D model: every level's members and every column length, with the
 * W-shape profile each one is drawn with and where it sits in space. Pure; read by the IFC
 * export (ISO 16739) on the server and by the Building view in the browser, so both show the
 * same framing.
 *
 * Conventions: plan feet (x east, y north), z up in feet from elevation 0. A member's top of
 * steel lies at its level's elevation (common practice: floor framing is set out from top of
 * steel at the level); it runs node to node along its centreline (no connection setbacks).
 * A column is one length per level it supports: from that level's elevation down to the next
 * lower level the column supports, and the lowest length to the next lower level of the
 * plan, else to elevation 0 ft (calc-interface.md, columns).
 *
 * Profiles: the designed shape where there is one; else a shape locked on the plan; else a
 * placeholder (labelled `sized: false`, "not sized") so the piece can still be drawn, never
 * presented as a design.
 */
import { findWShape, type WShape } from '../catalog/w-shapes.catalog';
import type { Plan } from '../schemas/plan.schema';

/** A stand-in profile for a member the engine did not size (drawn only, labelled "not sized"). */
export const PLACEHOLDER_MEMBER_SHAPE = 'W12X26';
/** A stand-in profile for a column with no size anywhere in its stack (labelled "not sized"). */
export const PLACEHOLDER_COLUMN_SHAPE = 'W10X49';
export const NOT_SIZED = 'not sized';

export interface IProfile {
  /** The catalog label the dimensions come from (the placeholder's when not sized). */
  label: string;
  d_in: number;
  bf_in: number;
  tw_in: number;
  tf_in: number;
}

export interface ReactionEndSummary {
  D_kip: number;
  L_kip: number;
  Lr_kip: number;
  S_kip: number;
  supportedBy: string | null;
}

export interface BuildingMember {
  id: string;
  kind: 'girder' | 'beam';
  level: string;
  mark: string;
  /** The size as designed or locked; "not sized" when neither. */
  size: string;
  sized: boolean;
  profile: IProfile;
  start: readonly [number, number];
  end: readonly [number, number];
  /** Top of steel = the level's elevation, ft. */
  topElevation_ft: number;
  length_ft: number;
  ratio: number | null;
  passes: boolean | null;
  governing: string | null;
  /** From the design when composite design provides it; null otherwise. */
  camber_in: number | null;
  studs: number | null;
  reactions: { start: ReactionEndSummary; end: ReactionEndSummary } | null;
}

export interface BuildingColumn {
  /** `${columnId}@${levelId}`: one length of a column. */
  id: string;
  columnId: string;
  /** The level this length supports (at its top). */
  level: string;
  x_ft: number;
  y_ft: number;
  baseElevation_ft: number;
  topElevation_ft: number;
  length_ft: number;
  size: string;
  sized: boolean;
  profile: IProfile;
  ratio: number | null;
  Pr_kip: number | null;
}

export interface BuildingStorey {
  id: string;
  name: string;
  elevation_ft: number;
}

export interface BuildingModel {
  storeys: BuildingStorey[];
  members: BuildingMember[];
  columns: BuildingColumn[];
}

/** What the model reads of a design (the `calc plan` output); extra fields are optional. */
export interface BuildingDesignInput {
  members: {
    id: string;
    mark?: string;
    shape: string | null;
    span_ft?: number;
    ratio?: number | null;
    passes?: boolean;
    governing?: string | null;
    camber_in?: number | null;
    studs?: number | null;
    reactions?: { start: Partial<ReactionEndSummary>; end: Partial<ReactionEndSummary> };
  }[];
  columns?: { id: string; levels: { level: string; shape?: string | null; ratio?: number | null; Pr_kip?: number }[] }[];
}

function profileOf(shape: WShape): IProfile {
  return { label: shape.label, d_in: shape.d_in, bf_in: shape.bf_in, tw_in: shape.tw_in, tf_in: shape.tf_in };
}

function catalogProfile(label: string | null | undefined): IProfile | null {
  if (!label) return null;
  const s = findWShape(label);
  return s ? profileOf(s) : null;
}

const finiteOrNull = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

function reactionEnd(r: Partial<ReactionEndSummary> | undefined): ReactionEndSummary {
  return {
    D_kip: r?.D_kip ?? 0,
    L_kip: r?.L_kip ?? 0,
    Lr_kip: r?.Lr_kip ?? 0,
    S_kip: r?.S_kip ?? 0,
    supportedBy: r?.supportedBy ?? null,
  };
}

/**
 * The building model of a plan and (optionally) its design. Without a design every member
 * takes its locked shape or the placeholder, and carries no ratio.
 */
export interface BuildingPlanInput {
  levels: Plan['levels'];
  members: Plan['members'];
  /** `shape` is read when the plan carries a locked column size (plan file version 2). */
  columns: (Plan['columns'][number] & { shape?: string | null })[];
}

export function buildingModel(plan: BuildingPlanInput, design?: BuildingDesignInput | null): BuildingModel {
  const elevation = new Map(plan.levels.map((l) => [l.id, l.elevation_ft]));
  const storeys = [...plan.levels]
    .sort((a, b) => a.elevation_ft - b.elevation_ft)
    .map((l) => ({ id: l.id, name: l.name, elevation_ft: l.elevation_ft }));
  const designed = new Map((design?.members ?? []).map((m) => [m.id, m]));

  const members: BuildingMember[] = [];
  for (const pm of plan.members) {
    const top = elevation.get(pm.level);
    if (top === undefined) continue; // the plan's repair step reports members on unknown levels
    const dm = designed.get(pm.id);
    const shape = dm ? dm.shape : pm.shape;
    const profile = catalogProfile(shape);
    const length = Math.hypot(pm.end[0] - pm.start[0], pm.end[1] - pm.start[1]);
    if (length <= 0) continue;
    members.push({
      id: pm.id,
      kind: pm.kind,
      level: pm.level,
      mark: dm?.mark ?? pm.mark ?? '',
      size: profile ? profile.label : NOT_SIZED,
      sized: profile !== null,
      profile: profile ?? catalogProfile(PLACEHOLDER_MEMBER_SHAPE)!,
      start: [pm.start[0], pm.start[1]],
      end: [pm.end[0], pm.end[1]],
      topElevation_ft: top,
      length_ft: length,
      ratio: finiteOrNull(dm?.ratio),
      passes: dm?.passes ?? null,
      governing: dm?.governing ?? null,
      camber_in: finiteOrNull(dm?.camber_in),
      studs: finiteOrNull(dm?.studs),
      reactions: dm?.reactions ? { start: reactionEnd(dm.reactions.start), end: reactionEnd(dm.reactions.end) } : null,
    });
  }

  const designedColumns = new Map((design?.columns ?? []).map((c) => [c.id, new Map(c.levels.map((l) => [l.level, l]))]));
  const planElevations = [...new Set(plan.levels.map((l) => l.elevation_ft))].sort((a, b) => a - b);
  const columns: BuildingColumn[] = [];
  for (const pc of plan.columns) {
    const own = pc.levels
      .filter((id) => elevation.has(id))
      .map((id) => ({ id, elevation_ft: elevation.get(id)! }))
      .sort((a, b) => a.elevation_ft - b.elevation_ft);
    const stack = designedColumns.get(pc.id);
    // A size anywhere in the stack stands in for a length without one (still labelled not sized).
    const stackShape = [...(stack?.values() ?? [])].map((l) => l.shape).find((s) => catalogProfile(s)) ?? pc.shape ?? null;
    own.forEach((lvl, i) => {
      const below = i > 0 ? own[i - 1].elevation_ft : [...planElevations].reverse().find((e) => e < lvl.elevation_ft) ?? 0;
      const length = lvl.elevation_ft - below;
      if (length <= 0) return;
      const entry = stack?.get(lvl.id);
      const ownProfile = catalogProfile(entry?.shape ?? pc.shape);
      const profile = ownProfile ?? catalogProfile(stackShape) ?? catalogProfile(PLACEHOLDER_COLUMN_SHAPE)!;
      columns.push({
        id: `${pc.id}@${lvl.id}`,
        columnId: pc.id,
        level: lvl.id,
        x_ft: pc.x_ft,
        y_ft: pc.y_ft,
        baseElevation_ft: below,
        topElevation_ft: lvl.elevation_ft,
        length_ft: length,
        size: ownProfile ? ownProfile.label : NOT_SIZED,
        sized: ownProfile !== null,
        profile,
        ratio: finiteOrNull(entry?.ratio),
        Pr_kip: finiteOrNull(entry?.Pr_kip),
      });
    });
  }
  return { storeys, members, columns };
}
