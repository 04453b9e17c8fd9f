import { estimateCost, type UnitPrices } from '../../shared/tonnage/cost';
import {
  columnTonnageRows,
  computeTonnage,
  type TonnageDesignInput,
  type TonnageFigures,
  type TonnageLevelInput,
  type TonnageMemberInput,
} from '../../shared/tonnage/tonnage';
import type { Db } from '../models/models';
import type { SchemeAttributes } from '../models/scheme.model';
import { AppError } from '../errors/app-error';
import { currentSchemeDesign, type SchemeDesignView } from './scheme-design.service';
import type { SchemeServiceContext } from './plan-store.service';

// Tonnage of one scheme from its stored design (designed first when stale), with the
// estimated cost from the firm's unit prices. The arithmetic lives in shared/tonnage.

/** Cost lines: null when the firm has no prices; studs_usd / camber_usd null also when that item is not priced. */
export type FiguresWithCost = TonnageFigures & {
  cost_usd: number | null;
  steel_usd: number | null;
  connections_usd: number | null;
  studs_usd: number | null;
  camber_usd: number | null;
};

export interface SchemeTonnageView {
  totals: FiguresWithCost;
  byLevel: (FiguresWithCost & { level: string; levelName: string })[];
  byKind: (FiguresWithCost & { kind: 'girder' | 'beam' | 'column' })[];
  revision: number;
  designedAt: string;
  failingMembers: number;
  problemCount: number;
}

function withCost<T extends TonnageFigures>(f: T, prices: UnitPrices | null): T & Omit<FiguresWithCost, keyof TonnageFigures> {
  if (!prices) return { ...f, cost_usd: null, steel_usd: null, connections_usd: null, studs_usd: null, camber_usd: null };
  const c = estimateCost(f, prices);
  return {
    ...f,
    ...c,
    studs_usd: prices.stud_usd_each == null ? null : c.studs_usd,
    camber_usd: prices.camber_usd_each == null ? null : c.camber_usd,
  };
}

/** The design fields tonnage reads, taken defensively from a stored result. */
export function tonnageInputOf(design: Record<string, unknown>): TonnageDesignInput {
  const members = Array.isArray(design.members) ? (design.members as Record<string, unknown>[]) : [];
  const totals = (design.totals ?? {}) as Record<string, unknown>;
  return {
    members: members.map(
      (m): TonnageMemberInput => ({
        id: String(m.id),
        level: String(m.level),
        kind: m.kind === 'girder' ? 'girder' : 'beam',
        shape: typeof m.shape === 'string' ? m.shape : null,
        span_ft: Number(m.span_ft) || 0,
        weight_plf: Number(m.weight_plf) || 0,
        ...(typeof m.endConnections === 'number' ? { endConnections: m.endConnections } : {}),
        ...(typeof m.studs === 'number' ? { studs: m.studs } : {}),
        ...(typeof m.camber_in === 'number' ? { camber_in: m.camber_in } : {}),
      }),
    ).concat(columnTonnageRows(design)),
    totals: {
      floorArea_ft2: typeof totals.floorArea_ft2 === 'number' ? totals.floorArea_ft2 : undefined,
      byLevel: Array.isArray(totals.byLevel)
        ? (totals.byLevel as { level: string; floorArea_ft2?: number }[]).map((l) => ({ level: String(l.level), floorArea_ft2: Number(l.floorArea_ft2) || 0 }))
        : undefined,
    },
  };
}

/** What tonnage derives from a run and the plan's levels, before prices. */
interface TonnageBase {
  t: ReturnType<typeof computeTonnage>;
  revision: number;
  designedAt: string;
  failingMembers: number;
  problemCount: number;
}

function tonnageBase(design: SchemeDesignView, levels: TonnageLevelInput[]): TonnageBase {
  const members = Array.isArray(design.members) ? (design.members as { passes?: boolean }[]) : [];
  return {
    t: computeTonnage(tonnageInputOf(design), levels),
    revision: design.revision,
    designedAt: design.designedAt,
    failingMembers: members.filter((m) => m.passes === false).length,
    problemCount: Array.isArray(design.problems) ? design.problems.length : 0,
  };
}

function pricedView(base: TonnageBase, prices: UnitPrices | null): SchemeTonnageView {
  const { t } = base;
  return {
    totals: withCost(t.totals, prices),
    byLevel: t.byLevel.map((l) => withCost(l, prices)),
    byKind: t.byKind.map((k) => withCost(k, prices)),
    revision: base.revision,
    designedAt: base.designedAt,
    failingMembers: base.failingMembers,
    problemCount: base.problemCount,
  };
}

export function tonnageView(design: SchemeDesignView, levels: TonnageLevelInput[], prices: UnitPrices | null): SchemeTonnageView {
  return pricedView(tonnageBase(design, levels), prices);
}

/**
 * Tonnage before prices, by design run and plan revision (the levels change only with a
 * save): a few kilobytes each, the most recently used kept. Prices are applied per request.
 */
const TONNAGE_CACHE_SIZE = 256;
const tonnageCache = new Map<string, TonnageBase>();

export async function schemeLevels(db: Db, schemeId: string): Promise<TonnageLevelInput[]> {
  const rows = await db.models.Level.findAll({ where: { schemeId }, order: [['position', 'ASC']] });
  return rows.map((r) => ({ id: r.getDataValue('elementId'), name: r.getDataValue('name'), elevation_ft: r.getDataValue('elevationFt') }));
}

/** A scheme's tonnage; a stale or missing design is designed first. */
export async function getSchemeTonnage(
  ctx: SchemeServiceContext,
  scheme: Pick<SchemeAttributes, 'id'>,
  prices: UnitPrices | null,
): Promise<SchemeTonnageView> {
  const current = await currentSchemeDesign(ctx, scheme.id, { designIfStale: true });
  if (current.revision !== current.scheme.revision) {
    throw new AppError(409, 'design_stale', 'The scheme changed while it was being designed; try again.');
  }
  const key = `${current.runId}:${current.scheme.revision}`;
  let base = tonnageCache.get(key);
  if (base) {
    tonnageCache.delete(key);
  } else {
    const [design, levels] = await Promise.all([current.view(), schemeLevels(ctx.db, scheme.id)]);
    if (design.stale) throw new AppError(409, 'design_stale', 'The scheme changed while it was being designed; try again.');
    base = tonnageBase(design, levels);
  }
  tonnageCache.set(key, base);
  while (tonnageCache.size > TONNAGE_CACHE_SIZE) tonnageCache.delete(tonnageCache.keys().next().value as string);
  return pricedView(base, prices);
}
