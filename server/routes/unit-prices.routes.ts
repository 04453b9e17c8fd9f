import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../app-context';
import { authOf, requireRole } from '../auth/auth.middleware';
import { validate } from '../middleware/validate.middleware';
import { getUnitPrices, listUnitPriceHistory, setUnitPrices } from '../services/unit-prices.service';

const usd = (field: string, min: number, max: number) =>
  z
    .number({ error: `${field} must be a number of US dollars` })
    .refine(Number.isFinite, { error: `${field} must be a number of US dollars` })
    .min(min, min > 0 ? `${field} must be more than zero` : `${field} cannot be negative`)
    .max(max, `${field} is at most $${max.toLocaleString('en-US')}`);

export const unitPricesBody = z.object({
  // A steel price of zero would make every estimate free: refused.
  steel_usd_per_ton: usd('Steel price per ton', 1, 100_000),
  connection_usd_each: usd('Price per connection', 0, 100_000),
  // Composite beams (issue 11): absent or null = not priced; estimates then leave them out.
  stud_usd_each: usd('Price per shear stud', 0, 1_000).nullable().optional().transform((v) => v ?? null),
  camber_usd_each: usd('Price per cambered piece', 0, 100_000).nullable().optional().transform((v) => v ?? null),
  note: z.string({ error: 'Note must be text' }).trim().max(500, 'Note is at most 500 characters').optional().transform((v) => (v ? v : null)),
});

/** /api/unit-prices: the firm's prices; everyone reads, owners and managers set them. */
export function unitPricesRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', requireRole('project:read'), async (_req, res) => {
    res.json(await getUnitPrices(ctx, authOf(res).firmId));
  });

  router.put('/', requireRole('prices:edit'), async (req, res) => {
    const { body } = validate(req, { body: unitPricesBody });
    const auth = authOf(res);
    res.json(await setUnitPrices(ctx, { firmId: auth.firmId, userId: auth.userId }, body));
  });

  router.get('/history', requireRole('project:read'), async (_req, res) => {
    res.json({ history: await listUnitPriceHistory(ctx, authOf(res).firmId) });
  });

  return router;
}
