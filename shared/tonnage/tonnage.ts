/**
 * Tonnage of a designed scheme: steel weight, weight per floor area, pieces and end
 * connections, in total, by level and by kind. Pure: reads a stored design (the `calc plan`
 * output, calc-interface.md) and the plan's levels; no I/O.
 *
 * Steel weight is Σ W_plf × span_ft over the members (the nominal weight per foot of the
 * shape times the member's span). Connection material (plates, angles, bolts, welds) is
 * excluded, as are columns and deck. Shear studs and cambered pieces of composite members are
 * counted beside the steel weight (studs are not steel weight here; selection's stud-equivalent
 * weight is a design device, not tonnage).
 */

/** Short ton (US customary): 2,000 lb. Common practice for steel tonnage in the US. */
export const LB_PER_TON = 2000;

/** End connections per member: one at each end (common practice for simple-span framing). */
export const END_CONNECTIONS_PER_MEMBER = 2;

export const TONNAGE_BASIS =
  'Steel weight is the sum of shape weight × span for the beams and girders of the design ' +
  '(W_plf × span_ft), plus shape weight × length for the gravity columns, each column length ' +
  'counted at the level it carries (the storey below that level). Connection material, splices, ' +
  'base plates and deck are excluded; shear studs and cambered pieces are counted separately. ' +
  'Connections count two per beam or girder, one at each end; a column piece is one tier between ' +
  'splices. Tons are short tons of 2,000 lb.';

export type MemberKind = 'girder' | 'beam' | 'column';
export const MEMBER_KINDS: readonly MemberKind[] = ['girder', 'beam', 'column'];

/** The member fields tonnage reads from a design. */
export interface TonnageMemberInput {
  id: string;
  level: string;
  kind: MemberKind;
  shape: string | null;
  span_ft: number;
  weight_plf: number;
  /**
   * End connections of this member when the design states them. The engine's `connections`
   * field also counts members framing in (those are the other member's end connections), so
   * it is not read here: counting it would count a beam-to-girder connection twice.
   */
  endConnections?: number;
  /** Composite members: total shear studs and camber (in); null or absent where not composite. */
  studs?: number | null;
  camber_in?: number | null;
  /** Pieces this row counts as (default 1): a column length counts 1 at the bottom of its tier, else 0. */
  pieces?: number;
}

/** The design fields tonnage reads (the stored `calc plan` output). */
export interface TonnageDesignInput {
  members: TonnageMemberInput[];
  totals?: {
    floorArea_ft2?: number;
    byLevel?: { level: string; floorArea_ft2?: number }[];
  };
}

export interface TonnageLevelInput {
  id: string;
  name: string;
  elevation_ft?: number;
}

export interface TonnageFigures {
  steelWeight_lb: number;
  steelWeight_tons: number;
  /** lb of steel per ft² of floor; null when the floor area is zero or unknown. */
  steel_psf: number | null;
  pieces: number;
  connections: number;
  floorArea_ft2: number;
  /** Members without a shape (not designed): their weight is the design's estimate. */
  unsizedPieces: number;
  /** Shear studs on composite members. */
  studs: number;
  /** Members with a camber. */
  camberedPieces: number;
}

export interface TonnageByLevel extends TonnageFigures {
  level: string;
  levelName: string;
}

export interface TonnageByKind extends TonnageFigures {
  kind: MemberKind;
}

export interface SchemeTonnage {
  totals: TonnageFigures;
  byLevel: TonnageByLevel[];
  byKind: TonnageByKind[];
}

/** W_plf × span_ft; a non-finite or negative input counts as 0 (never NaN in a total). */
export function memberSteelWeightLb(m: Pick<TonnageMemberInput, 'weight_plf' | 'span_ft'>): number {
  const w = Number.isFinite(m.weight_plf) && m.weight_plf > 0 ? m.weight_plf : 0;
  const l = Number.isFinite(m.span_ft) && m.span_ft > 0 ? m.span_ft : 0;
  return w * l;
}

export function memberEndConnections(m: Pick<TonnageMemberInput, 'endConnections'>): number {
  return typeof m.endConnections === 'number' && Number.isInteger(m.endConnections) && m.endConnections >= 0
    ? m.endConnections
    : END_CONNECTIONS_PER_MEMBER;
}

function figures(members: TonnageMemberInput[], floorArea_ft2: number): TonnageFigures {
  let steelWeight_lb = 0;
  let connections = 0;
  let unsizedPieces = 0;
  let studs = 0;
  let camberedPieces = 0;
  let pieces = 0;
  for (const m of members) {
    pieces += typeof m.pieces === 'number' && m.pieces >= 0 ? m.pieces : 1;
    steelWeight_lb += memberSteelWeightLb(m);
    connections += memberEndConnections(m);
    if (!m.shape) unsizedPieces++;
    if (typeof m.studs === 'number' && m.studs > 0) studs += m.studs;
    if (typeof m.camber_in === 'number' && m.camber_in > 0) camberedPieces++;
  }
  const area = Number.isFinite(floorArea_ft2) && floorArea_ft2 > 0 ? floorArea_ft2 : 0;
  return {
    steelWeight_lb,
    steelWeight_tons: steelWeight_lb / LB_PER_TON,
    steel_psf: area > 0 ? steelWeight_lb / area : null,
    pieces,
    connections,
    floorArea_ft2: area,
    unsizedPieces,
    studs,
    camberedPieces,
  };
}

/**
 * Totals, by level (in the plan's level order, top of the list first as the plan lists them;
 * levels the plan does not name are appended) and by kind (girders, then beams).
 */
export function computeTonnage(design: TonnageDesignInput, levels: readonly TonnageLevelInput[] = []): SchemeTonnage {
  const members = design.members ?? [];
  const areaByLevel = new Map<string, number>();
  for (const l of design.totals?.byLevel ?? []) areaByLevel.set(l.level, l.floorArea_ft2 ?? 0);

  const levelIds: string[] = levels.map((l) => l.id);
  for (const m of members) if (!levelIds.includes(m.level)) levelIds.push(m.level);
  const nameOf = new Map(levels.map((l) => [l.id, l.name]));

  const byLevel = levelIds.map((id) => ({
    level: id,
    levelName: nameOf.get(id) || id,
    ...figures(
      members.filter((m) => m.level === id),
      areaByLevel.get(id) ?? 0,
    ),
  }));

  // Total floor area: the design's figure, or the sum of its levels when it gives none.
  const levelAreaSum = [...areaByLevel.values()].reduce((s, a) => s + (a > 0 ? a : 0), 0);
  const totalArea = design.totals?.floorArea_ft2 ?? levelAreaSum;

  return {
    totals: figures(members, totalArea),
    byLevel,
    byKind: MEMBER_KINDS.map((kind) => ({
      kind,
      // Floor area belongs to levels, not kinds: psf by kind is over the whole floor area.
      ...figures(
        members.filter((m) => m.kind === kind),
        totalArea,
      ),
    })),
  };
}

/**
 * Gravity columns as tonnage rows: one per sized column length (at the level it carries), with
 * its tier's piece counted at the tier's lowest length and no beam end connections.
 */
export function columnTonnageRows(design: Record<string, unknown>): TonnageMemberInput[] {
  const columns = Array.isArray(design.columns) ? (design.columns as Record<string, unknown>[]) : [];
  const rows: TonnageMemberInput[] = [];
  for (const c of columns) {
    const levels = Array.isArray(c.levels) ? (c.levels as Record<string, unknown>[]) : [];
    levels.forEach((l, i) => {
      if (typeof l.shape !== 'string' || !(Number(l.Lc_ft) > 0)) return;
      const below = levels[i + 1];
      const bottomOfTier = !below || below.tier !== l.tier || typeof below.shape !== 'string';
      const weight = Number(l.shape.toUpperCase().split('X')[1]) || 0;
      rows.push({ id: `${String(c.id)}@${String(l.level)}`, level: String(l.level), kind: 'column', shape: l.shape, span_ft: Number(l.Lc_ft) || 0, weight_plf: weight, endConnections: 0, pieces: bottomOfTier ? 1 : 0 });
    });
  }
  return rows;
}

