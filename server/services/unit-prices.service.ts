import { notYetPriced, NOT_YET_PRICED, type UnitPrices } from '../../shared/tonnage/cost';
import type { Db } from '../models/models';
import type { UnitPriceAttributes } from '../models/unit-price.model';
import { recordAudit } from './audit.service';

// The firm's unit prices for cost estimates. Append-only: every change adds a row, the latest
// row is current, and the rows before it are the history (who set what, when).

export interface UnitPricesView extends UnitPrices {
  id: string;
  /** null = not priced (estimates leave studs or camber out). */
  stud_usd_each: number | null;
  camber_usd_each: number | null;
  /** The demo's invented example prices, until someone sets real ones. */
  example: boolean;
  note: string | null;
  setBy: { id: string; name: string } | null;
  setAt: string;
}

export interface UnitPricesResponse {
  /** null until anyone has set prices: costs are then not estimated. */
  prices: UnitPricesView | null;
  /** Items the estimate does not price yet. */
  notYetPriced: readonly string[];
  currency: 'USD';
}

interface PricesCtx {
  db: Db;
}

async function toViews(db: Db, rows: UnitPriceAttributes[]): Promise<UnitPricesView[]> {
  const ids = [...new Set(rows.map((r) => r.userId).filter((id): id is string => typeof id === 'string'))];
  const users = ids.length ? await db.models.User.findAll({ where: { id: ids }, attributes: ['id', 'name'] }) : [];
  const names = new Map(users.map((u) => [u.getDataValue('id'), u.getDataValue('name')]));
  return rows.map((r) => ({
    id: r.id,
    steel_usd_per_ton: r.steelUsdPerTon,
    connection_usd_each: r.connectionUsdEach,
    stud_usd_each: r.studUsdEach ?? null,
    camber_usd_each: r.camberUsdEach ?? null,
    example: Boolean(r.example),
    note: r.note,
    setBy: r.userId && names.has(r.userId) ? { id: r.userId, name: names.get(r.userId)! } : null,
    setAt: new Date(r.createdAt).toISOString(),
  }));
}

const NEWEST_FIRST: [string, string][] = [
  ['createdAt', 'DESC'],
  ['id', 'DESC'],
];

export async function getUnitPrices(ctx: PricesCtx, firmId: string): Promise<UnitPricesResponse> {
  const row = await ctx.db.models.UnitPrice.findOne({ where: { firmId }, order: NEWEST_FIRST });
  const [prices] = row ? await toViews(ctx.db, [row.get({ plain: true })]) : [null];
  return { prices: prices ?? null, notYetPriced: prices ? notYetPriced(prices) : NOT_YET_PRICED, currency: 'USD' };
}

export async function listUnitPriceHistory(ctx: PricesCtx, firmId: string): Promise<UnitPricesView[]> {
  const rows = await ctx.db.models.UnitPrice.findAll({ where: { firmId }, order: NEWEST_FIRST, limit: 500 });
  return toViews(ctx.db, rows.map((r) => r.get({ plain: true })));
}

export interface UnitPricesInput extends UnitPrices {
  note?: string | null;
}

/** Adds a row (never updates one) and records the change in the audit log. */
export async function setUnitPrices(
  ctx: PricesCtx,
  actor: { firmId: string; userId: string | null },
  input: UnitPricesInput,
  options: { example?: boolean } = {},
): Promise<UnitPricesResponse> {
  const before = await getUnitPrices(ctx, actor.firmId);
  // A distinct timestamp per row keeps "latest" unambiguous when two saves land in one ms.
  const last = before.prices ? new Date(before.prices.setAt).getTime() : 0;
  await ctx.db.models.UnitPrice.create({
    firmId: actor.firmId,
    steelUsdPerTon: input.steel_usd_per_ton,
    connectionUsdEach: input.connection_usd_each,
    studUsdEach: input.stud_usd_each ?? null,
    camberUsdEach: input.camber_usd_each ?? null,
    example: options.example ?? false,
    note: input.note ?? null,
    userId: actor.userId,
    createdAt: new Date(Math.max(Date.now(), last + 1)),
  });
  await recordAudit(ctx, {
    firmId: actor.firmId,
    userId: actor.userId,
    action: 'prices.changed',
    target: 'Unit prices',
    detail: {
      from: before.prices
        ? {
            steel_usd_per_ton: before.prices.steel_usd_per_ton,
            connection_usd_each: before.prices.connection_usd_each,
            stud_usd_each: before.prices.stud_usd_each,
            camber_usd_each: before.prices.camber_usd_each,
          }
        : null,
      to: {
        steel_usd_per_ton: input.steel_usd_per_ton,
        connection_usd_each: input.connection_usd_each,
        stud_usd_each: input.stud_usd_each ?? null,
        camber_usd_each: input.camber_usd_each ?? null,
      },
    },
  });
  return getUnitPrices(ctx, actor.firmId);
}
