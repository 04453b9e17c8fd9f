// The Member sheet's constraint fields as typed (depths in the display unit, nominal depths as
// a list) and their parse into MemberConstraints (inches, as the plan stores them).
import { z } from 'zod';
import { listWShapes, nominalDepthIn } from '../../../../shared/catalog/w-shapes.catalog';
import { formatValue, parseQuantity, type UnitSystem } from '../../../lib/units';
import type { MemberConstraints } from './member-sheet.model';

export interface ConstraintsFormValues {
  maxDepth: string;
  minDepth: string;
  nominalDepths: string;
}

/** Nominal depths present in AISC Shapes Database v15.0, ascending (W4 … W44). */
export const CATALOG_NOMINAL_DEPTHS: readonly number[] = [...new Set(listWShapes().map((s) => nominalDepthIn(s)))].sort((a, b) => a - b);

/** Shapes of the catalog that satisfy the constraints (depth bounds on the actual depth d). */
export function shapesWithin(c: MemberConstraints): number {
  const series = c.allowedNominalDepths && c.allowedNominalDepths.length ? new Set(c.allowedNominalDepths) : null;
  return listWShapes().filter(
    (s) => (c.maxDepth_in == null || s.d_in <= c.maxDepth_in) && (c.minDepth_in == null || s.d_in >= c.minDepth_in) && (series === null || series.has(nominalDepthIn(s))),
  ).length;
}

export function toConstraintsForm(c: MemberConstraints, system: UnitSystem): ConstraintsFormValues {
  const depth = (v: number | null) => (v == null ? '' : formatValue('length_in', v, system, { digits: system === 'SI' ? 1 : 2 }).replace(/\.?0+$/, ''));
  return {
    maxDepth: depth(c.maxDepth_in),
    minDepth: depth(c.minDepth_in),
    nominalDepths: c.allowedNominalDepths?.join(', ') ?? '',
  };
}

/**
 * Builds the schema for the current display system. A depth whose text was not touched keeps
 * its stored value exactly (no drift from showing 533.4 mm and reading it back).
 */
export function constraintsSchema(system: UnitSystem, initial: MemberConstraints) {
  const shownInitial = toConstraintsForm(initial, system);
  const depth = (field: 'maxDepth' | 'minDepth', label: string, stored: number | null) =>
    z.string().transform((text, ctx): number | null => {
      const t = text.trim();
      if (t === '') return null;
      if (t === shownInitial[field].trim() && stored != null) return stored;
      const parsed = parseQuantity('length_in', t, system);
      if (!parsed.ok) {
        ctx.addIssue({ code: 'custom', message: `${label}: ${parsed.error}` });
        return z.NEVER;
      }
      if (!(parsed.value > 0)) {
        ctx.addIssue({ code: 'custom', message: `${label} must be greater than zero` });
        return z.NEVER;
      }
      return parsed.value;
    });

  return z
    .object({
      maxDepth: depth('maxDepth', 'Maximum depth', initial.maxDepth_in),
      minDepth: depth('minDepth', 'Minimum depth', initial.minDepth_in),
      nominalDepths: z.string().transform((text, ctx): number[] | null => {
        const parts = text.split(/[\s,;]+/).filter(Boolean);
        if (parts.length === 0) return null;
        const out: number[] = [];
        for (const p of parts) {
          const n = Number(p.replace(/^W/i, ''));
          if (!Number.isInteger(n) || !CATALOG_NOMINAL_DEPTHS.includes(n)) {
            ctx.addIssue({ code: 'custom', message: `"${p}" is not a W-shape nominal depth; the catalog has ${CATALOG_NOMINAL_DEPTHS.join(', ')}` });
            return z.NEVER;
          }
          if (!out.includes(n)) out.push(n);
        }
        return out.sort((a, b) => a - b);
      }),
    })
    .superRefine((v, ctx) => {
      if (v.maxDepth != null && v.minDepth != null && v.minDepth > v.maxDepth) {
        ctx.addIssue({ code: 'custom', path: ['minDepth'], message: 'Minimum depth is more than the maximum depth' });
        return;
      }
      const c = { maxDepth_in: v.maxDepth, minDepth_in: v.minDepth, allowedNominalDepths: v.nominalDepths };
      if (shapesWithin(c) === 0) {
        ctx.addIssue({ code: 'custom', path: ['maxDepth'], message: 'No W-shape in the catalog fits these limits together' });
      }
    })
    .transform((v): MemberConstraints => ({ maxDepth_in: v.maxDepth, minDepth_in: v.minDepth, allowedNominalDepths: v.nominalDepths }));
}
