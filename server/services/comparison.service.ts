import { compositePricesText, notYetPriced } from '../../shared/tonnage/cost';
import { LB_PER_TON, TONNAGE_BASIS } from '../../shared/tonnage/tonnage';
import { SCHEME_CAUTION } from '../../shared/engine/index';
import { AppError } from '../errors/app-error';
import type { SchemeStatus } from '../models/scheme.model';
import { assertOwnProject, type SchemeServiceContext } from './plan-store.service';
import { getSchemeTonnage, type FiguresWithCost, type SchemeTonnageView } from './tonnage.service';
import { getUnitPrices, type UnitPricesResponse } from './unit-prices.service';

// GET /api/projects/:id/comparison: the project's schemes side by side, each from a design of
// its current plan (stale ones are designed first), with cost from the firm's unit prices.

export interface ComparisonScheme extends Partial<SchemeTonnageView> {
  id: string;
  name: string;
  status: SchemeStatus;
  archived: boolean;
  /** Set when the scheme could not be designed; its figures are then absent (never zero). */
  designError?: string;
}

export interface Comparison {
  project: { id: string; name: string };
  schemes: ComparisonScheme[];
  prices: UnitPricesResponse;
  basis: string;
  caution: string;
  generatedAt: string;
}

export interface ComparisonOptions {
  schemeIds?: string[];
  archived: 'include' | 'exclude';
}

export async function getComparison(ctx: SchemeServiceContext, projectId: string, options: ComparisonOptions): Promise<Comparison> {
  await assertOwnProject(ctx, projectId);
  const project = await ctx.db.models.Project.findByPk(projectId, { attributes: ['id', 'name'] });
  const all = await ctx.db.models.Scheme.findAll({
    where: { projectId },
    order: [
      ['createdAt', 'ASC'],
      ['name', 'ASC'],
    ],
  });
  let rows = all.map((r) => r.get({ plain: true }));
  if (options.schemeIds && options.schemeIds.length > 0) {
    // Asked for by id: those schemes, in the order asked, archived or not.
    const byId = new Map(rows.map((r) => [r.id, r]));
    const missing = options.schemeIds.filter((id) => !byId.has(id));
    if (missing.length > 0) {
      throw new AppError(404, 'not_found', `Scheme not found in this project: ${missing.join(', ')}.`, {
        fields: { schemes: `Not a scheme of this project: ${missing.join(', ')}` },
      });
    }
    rows = [...new Set(options.schemeIds)].map((id) => byId.get(id)!);
  } else if (options.archived === 'exclude') {
    rows = rows.filter((r) => !r.archived);
  }

  const pricesResponse = await getUnitPrices(ctx, ctx.actor.firmId);
  const prices = pricesResponse.prices;
  const schemes: ComparisonScheme[] = [];
  for (const row of rows) {
    const base = { id: row.id, name: row.name, status: row.status, archived: Boolean(row.archived) };
    try {
      schemes.push({ ...base, ...(await getSchemeTonnage(ctx, row, prices)) });
    } catch (err) {
      // One scheme that cannot be designed must not hide the others.
      if (err instanceof AppError && err.status === 422) schemes.push({ ...base, designError: err.message });
      else throw err;
    }
  }
  return {
    project: { id: projectId, name: project?.getDataValue('name') ?? '' },
    schemes,
    prices: pricesResponse,
    basis: TONNAGE_BASIS,
    caution: SCHEME_CAUTION,
    generatedAt: new Date().toISOString(),
  };
}

// ---------------------------------------------------------------------------------------
// CSV: one row per scheme and breakdown (total, each level, each kind).

function csvCell(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'number' ? (Number.isInteger(v) ? String(v) : v.toFixed(2)) : v;
  // Quote text; neutralise spreadsheet formulas in names people typed.
  if (typeof v === 'string') {
    const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
    return `"${safe.replace(/"/g, '""')}"`;
  }
  return s;
}

const CSV_HEADER = [
  'scheme',
  'status',
  'breakdown',
  'item',
  'steelWeight_lb',
  'steelWeight_tons',
  'steel_psf',
  'pieces',
  'connections',
  'floorArea_ft2',
  'steel_usd',
  'connections_usd',
  'cost_usd',
  'studs',
  'camberedPieces',
  'studs_usd',
  'camber_usd',
];

function figuresCells(f: FiguresWithCost): (string | number | null)[] {
  return [
    Math.round(f.steelWeight_lb),
    f.steelWeight_lb / LB_PER_TON,
    f.steel_psf,
    f.pieces,
    f.connections,
    Math.round(f.floorArea_ft2),
    f.steel_usd === null ? null : Math.round(f.steel_usd),
    f.connections_usd === null ? null : Math.round(f.connections_usd),
    f.cost_usd === null ? null : Math.round(f.cost_usd),
    f.studs ?? 0,
    f.camberedPieces ?? 0,
    f.studs_usd === null ? null : Math.round(f.studs_usd),
    f.camber_usd === null ? null : Math.round(f.camber_usd),
  ];
}

export function comparisonCsv(c: Comparison): string {
  const lines: string[] = [];
  lines.push(`# Baywright tonnage comparison: ${c.project.name}, ${c.generatedAt.slice(0, 10)}`);
  lines.push(`# Caution: ${c.caution}`);
  lines.push(`# ${c.basis}`);
  const p = c.prices.prices;
  lines.push(
    p
      ? `# Unit prices${p.example ? ' (invented example, not a quotation)' : ''}: $${p.steel_usd_per_ton.toLocaleString('en-US')}/ton fabricated and erected; $${p.connection_usd_each.toLocaleString('en-US')} per connection${compositePricesText(p) ? `; ${compositePricesText(p)}` : ''}.${notYetPriced(p).length ? ` Not yet priced: ${notYetPriced(p).join(', ')}.` : ''}`
      : '# No unit prices set: costs are not estimated.',
  );
  lines.push(CSV_HEADER.join(','));
  for (const s of c.schemes) {
    if (!s.totals) {
      lines.push([csvCell(s.name), csvCell(s.status), csvCell('total'), csvCell(`not designed: ${s.designError ?? ''}`)].join(','));
      continue;
    }
    const row = (breakdown: string, item: string, f: FiguresWithCost) =>
      lines.push([csvCell(s.name), csvCell(s.status), csvCell(breakdown), csvCell(item), ...figuresCells(f).map(csvCell)].join(','));
    row('total', 'all', s.totals);
    for (const l of s.byLevel ?? []) row('level', l.levelName, l);
    for (const k of s.byKind ?? []) row('kind', k.kind, k);
  }
  // The byte order mark lets spreadsheet programs read the UTF-8 names (—, ², …) correctly.
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

/** "harrow-quay-clinic-tonnage-2025-03-14" */
export function comparisonFileStem(c: Comparison): string {
  const slug = c.project.name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${slug || 'project'}-tonnage-${c.generatedAt.slice(0, 10)}`;
}
