// What a person types in the Design basis form, and how it becomes the plan's designBasis.
// Text fields stay text until the zod parse so a blank deflection limit means "skip it".
import { z } from 'zod';
import { DEFAULT_COMPOSITE_SETTINGS, type PlanCompositeSettings, type PlanDesignBasis } from '../../../../shared/schemas/plan.schema';

/** AISC 360-16 covers more, but the form keeps to the grades used for rolled W-shapes (common practice). */
export const FY_MIN_KSI = 36;
export const FY_MAX_KSI = 70;
/** ASTM A992, the usual grade for rolled W-shapes in the US (common practice). */
export const FY_DEFAULT_KSI = 50;
/** IBC Table 1604.3, floor members: live L/360, total (dead + live) L/240. */
export const IBC_DEFLECTION_DEFAULTS = { live: 360, total: 240 } as const;
const DENOMINATOR_MAX = 10000;

/**
 * Composite beams (design-basis §6, §6a). Headed studs through formed deck: 1/2, 5/8 or 3/4 in
 * (AISC 360-16 I3.2c(1): at most 3/4 in. diameter through deck). Fu 65 ksi for Type B studs
 * (AWS D1.1 Table 9.1, recalled from memory). At least 25 % composite, construction live
 * about 20 psf, a stud counted as about 10 lb of steel (common practice). The form refuses a
 * minimum below 25 % (the conservative reading of the practice minimum).
 */
export const STUD_DIAMETERS_IN = ['0.5', '0.625', '0.75'] as const;
export const STUD_FU_RANGE_KSI = { min: 50, max: 100 } as const;
export const MIN_COMPOSITE_PCT_RANGE = { min: 25, max: 100 } as const;
export const STUD_EQUIVALENT_WEIGHT_DEFAULT_LB = 10;
export const STUD_EQUIVALENT_WEIGHT_MAX_LB = 50;
export const CONSTRUCTION_LIVE_MAX_PSF = 100;

export type TotalDeflectionIncludes = NonNullable<PlanDesignBasis['totalDeflectionIncludes']>;

export interface DesignBasisFormValues {
  method: 'LRFD' | 'ASD';
  Fy_ksi: string;
  liveLimit: string;
  totalLimit: string;
  liveLoadReduction: boolean;
  totalDeflectionIncludes: TotalDeflectionIncludes;
  compositeEnabled: boolean;
  studDiameter_in: (typeof STUD_DIAMETERS_IN)[number];
  studFu_ksi: string;
  minPercentComposite: string;
  studEquivalentWeight_lb: string;
  constructionLive_psf: string;
  shored: boolean;
  camber: boolean;
}

const denominator = (what: string) =>
  z
    .string()
    .trim()
    .refine((v) => v === '' || (/^\d+$/.test(v) && Number(v) >= 1 && Number(v) <= DENOMINATOR_MAX), {
      message: `${what}: a whole number n of span/n (for example ${what.startsWith('Live') ? 360 : 240}), or blank to skip the check`,
    })
    .transform((v) => (v === '' ? null : Number(v)));

/** A number typed as text, bounded; the message names the field and its range. */
const bounded = (what: string, unit: string, min: number, max: number) =>
  z
    .string()
    .trim()
    .refine((v) => /^-?\d+(\.\d+)?$/.test(v), { message: `${what} must be a number in ${unit}` })
    .transform(Number)
    .refine((n) => Number.isNaN(n) || (n >= min && n <= max), { message: `${what} must be between ${min} and ${max} ${unit}` });

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
    compositeEnabled: z.boolean(),
    studDiameter_in: z.enum(STUD_DIAMETERS_IN, { error: 'Choose a stud diameter of 1/2, 5/8 or 3/4 in' }),
    studFu_ksi: bounded('Stud Fu', 'ksi', STUD_FU_RANGE_KSI.min, STUD_FU_RANGE_KSI.max),
    minPercentComposite: bounded('Minimum composite', '%', MIN_COMPOSITE_PCT_RANGE.min, MIN_COMPOSITE_PCT_RANGE.max),
    studEquivalentWeight_lb: bounded('Steel-equivalent weight of a stud', 'lb', 0, STUD_EQUIVALENT_WEIGHT_MAX_LB),
    constructionLive_psf: bounded('Construction live load', 'psf', 0, CONSTRUCTION_LIVE_MAX_PSF),
    shored: z.boolean(),
    camber: z.boolean(),
  })
  .transform(
    (v): PlanDesignBasis => ({
      method: v.method,
      Fy_ksi: v.Fy_ksi,
      liveLoadReduction: v.liveLoadReduction,
      deflectionLimits: { live: v.liveLimit, total: v.totalLimit },
      totalDeflectionIncludes: v.totalDeflectionIncludes,
      composite: {
        enabled: v.compositeEnabled,
        studDiameter_in: Number(v.studDiameter_in),
        studFu_ksi: v.studFu_ksi,
        // The form speaks percent; the plan file stores a fraction (calc-interface.md "Additions").
        minPercentComposite: Math.round(v.minPercentComposite * 100) / 10000,
        constructionLive_psf: v.constructionLive_psf,
        shored: v.shored,
        camber: v.camber,
        studEquivalentWeight_lb: v.studEquivalentWeight_lb,
      },
    }),
  );

/** The plan's composite settings, or the defaults a plan without them designs to. */
export function compositeOf(basis: PlanDesignBasis): PlanCompositeSettings {
  return { ...DEFAULT_COMPOSITE_SETTINGS, ...(basis.composite ?? {}) };
}

function closestDiameter(d: number): (typeof STUD_DIAMETERS_IN)[number] {
  return STUD_DIAMETERS_IN.reduce((best, x) => (Math.abs(Number(x) - d) < Math.abs(Number(best) - d) ? x : best), STUD_DIAMETERS_IN[2]);
}

export function toFormValues(basis: PlanDesignBasis): DesignBasisFormValues {
  return {
    method: basis.method,
    Fy_ksi: String(basis.Fy_ksi ?? FY_DEFAULT_KSI),
    liveLimit: basis.deflectionLimits.live == null ? '' : String(basis.deflectionLimits.live),
    totalLimit: basis.deflectionLimits.total == null ? '' : String(basis.deflectionLimits.total),
    liveLoadReduction: basis.liveLoadReduction,
    totalDeflectionIncludes: basis.totalDeflectionIncludes ?? 'deadAndLive',
    ...(() => {
      const c = compositeOf(basis);
      return {
        compositeEnabled: c.enabled,
        studDiameter_in: closestDiameter(c.studDiameter_in),
        studFu_ksi: String(c.studFu_ksi),
        minPercentComposite: String(Math.round(c.minPercentComposite * 10000) / 100),
        studEquivalentWeight_lb: String(c.studEquivalentWeight_lb ?? STUD_EQUIVALENT_WEIGHT_DEFAULT_LB),
        constructionLive_psf: String(c.constructionLive_psf),
        shored: c.shored,
        camber: c.camber,
      };
    })(),
  };
}

/**
 * What the form's output becomes on the plan: settings the form does not show (columns) are
 * kept, and a plan that had no composite settings gets none unless composite was switched on
 * or a setting changed from its default.
 */
export function mergeDesignBasis(before: PlanDesignBasis, next: PlanDesignBasis): PlanDesignBasis {
  const out: PlanDesignBasis = { ...before, ...next };
  if (!before.composite && next.composite) {
    const defaults = { ...DEFAULT_COMPOSITE_SETTINGS, studEquivalentWeight_lb: STUD_EQUIVALENT_WEIGHT_DEFAULT_LB };
    const same = (Object.keys(defaults) as (keyof PlanCompositeSettings)[]).every((k) => next.composite![k] === defaults[k]);
    if (same) delete out.composite;
  }
  return out;
}

/** A new project's basis: LRFD, A992 (50 ksi), IBC Table 1604.3 floor limits, live load reduction on. */
export const DEFAULT_DESIGN_BASIS: PlanDesignBasis = {
  method: 'LRFD',
  Fy_ksi: FY_DEFAULT_KSI,
  liveLoadReduction: true,
  deflectionLimits: { ...IBC_DEFLECTION_DEFAULTS },
  totalDeflectionIncludes: 'deadAndLive',
};
