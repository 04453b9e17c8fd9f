// What a person types in the Design basis form, and how it becomes the plan's designBasis.
// Text fields stay text until the zod parse so a blank deflection limit means "skip it".
import { z } from 'zod';
import type { PlanDesignBasis } from '../../../../shared/schemas/plan.schema';

/** AISC 360-16 covers more, but the form keeps to the grades used for rolled W-shapes (common practice). */
export const FY_MIN_KSI = 36;
export const FY_MAX_KSI = 70;
/** ASTM A992, the usual grade for rolled W-shapes in the US (common practice). */
export const FY_DEFAULT_KSI = 50;
/** IBC Table 1604.3, floor members: live L/360, total (dead + live) L/240. */
export const IBC_DEFLECTION_DEFAULTS = { live: 360, total: 240 } as const;
const DENOMINATOR_MAX = 10000;

export type TotalDeflectionIncludes = NonNullable<PlanDesignBasis['totalDeflectionIncludes']>;

export interface DesignBasisFormValues {
  method: 'LRFD' | 'ASD';
  Fy_ksi: string;
  liveLimit: string;
  totalLimit: string;
  liveLoadReduction: boolean;
  totalDeflectionIncludes: TotalDeflectionIncludes;
}

const denominator = (what: string) =>
  z
    .string()
    .trim()
    .refine((v) => v === '' || (/^\d+$/.test(v) && Number(v) >= 1 && Number(v) <= DENOMINATOR_MAX), {
      message: `${what}: a whole number n of span/n (for example ${what.startsWith('Live') ? 360 : 240}), or blank to skip the check`,
    })
    .transform((v) => (v === '' ? null : Number(v)));

export const designBasisFormSchema = z
  .object({
    method: z.enum(['LRFD', 'ASD'], { error: 'Choose LRFD or ASD' }),
    Fy_ksi: z
      .string()
      .trim()
      .refine((v) => v !== '', { message: 'Enter Fy in ksi (50 for ASTM A992)' })
      // a sign is a number too: -5 reads as out of range, not as "not a number"
      .refine((v) => v === '' || /^-?\d+(\.\d+)?$/.test(v), { message: 'Fy must be a number in ksi, such as 50' })
      .transform(Number)
      .refine((n) => Number.isNaN(n) || (n >= FY_MIN_KSI && n <= FY_MAX_KSI), {
        message: `Fy must be between ${FY_MIN_KSI} and ${FY_MAX_KSI} ksi`,
      }),
    liveLimit: denominator('Live-load limit'),
    totalLimit: denominator('Total-load limit'),
    liveLoadReduction: z.boolean(),
    totalDeflectionIncludes: z.enum(['deadAndLive', 'superimposedDeadAndLive']),
  })
  .transform(
    (v): PlanDesignBasis => ({
      method: v.method,
      Fy_ksi: v.Fy_ksi,
      liveLoadReduction: v.liveLoadReduction,
      deflectionLimits: { live: v.liveLimit, total: v.totalLimit },
      totalDeflectionIncludes: v.totalDeflectionIncludes,
    }),
  );

export function toFormValues(basis: PlanDesignBasis): DesignBasisFormValues {
  return {
    method: basis.method,
    Fy_ksi: String(basis.Fy_ksi ?? FY_DEFAULT_KSI),
    liveLimit: basis.deflectionLimits.live == null ? '' : String(basis.deflectionLimits.live),
    totalLimit: basis.deflectionLimits.total == null ? '' : String(basis.deflectionLimits.total),
    liveLoadReduction: basis.liveLoadReduction,
    totalDeflectionIncludes: basis.totalDeflectionIncludes ?? 'deadAndLive',
  };
}

/** A new project's basis: LRFD, A992 (50 ksi), IBC Table 1604.3 floor limits, live load reduction on. */
export const DEFAULT_DESIGN_BASIS: PlanDesignBasis = {
  method: 'LRFD',
  Fy_ksi: FY_DEFAULT_KSI,
  liveLoadReduction: true,
  deflectionLimits: { ...IBC_DEFLECTION_DEFAULTS },
  totalDeflectionIncludes: 'deadAndLive',
};
