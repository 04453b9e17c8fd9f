/**
 * The `calc member` input (shared/reference/calc-interface.md): zod types first, then the
 * engine's cross-field rules (positions within the span, known shape…), each problem naming
 * its field path, e.g. "loads[2].x_ft: must be within the span 0–32 ft".
 */
import { z } from 'zod';
import type { MemberDesignInput } from '../engine/index';
import { formatProblemPath, memberInputProblems } from '../engine/index';

const num = z.number({ error: 'must be a number' });
const loadCase = z.enum(['D', 'L', 'Lr', 'S'], { error: 'must be one of D, L, Lr, S' });
const source = z.string().optional();

export const memberLoadSchema = z.discriminatedUnion('kind', [
  z.object({ case: loadCase, kind: z.literal('uniform'), w_klf: num, source }),
  z.object({ case: loadCase, kind: z.literal('partial'), w_klf: num, from_ft: num, to_ft: num, source }),
  z.object({ case: loadCase, kind: z.literal('linear'), w1_klf: num, w2_klf: num, from_ft: num, to_ft: num, source }),
  z.object({ case: loadCase, kind: z.literal('point'), P_kip: num, x_ft: num, source }),
], {
  error: (iss) => (iss.input === null || typeof iss.input !== 'object' ? 'must be a load object with a kind' : 'must be one of uniform, partial, linear, point'),
});

export const bracingSchema = z.union([
  z.literal('continuous'),
  z.literal('none'),
  z.object({ points_ft: z.array(num) }),
], { error: 'must be "continuous", "none" or { "points_ft": [...] }' });

const positiveNum = num.positive({ error: 'must be a number greater than 0' });

/** calc-interface.md "Additions": the optional `composite` object of `calc member`. */
export const compositeMemberInputSchema = z
  .object({
    slab: z.object({
      ribHeight_in: positiveNum,
      toppingThickness_in: positiveNum,
      ribAvgWidth_in: positiveNum,
      ribSpacing_in: positiveNum,
      concreteWeight_pcf: positiveNum,
      fc_ksi: positiveNum,
      deckWeight_psf: num.nonnegative({ error: 'must be a number ≥ 0' }),
    }, { error: 'must be the slab build-up object' }).strict(),
    effectiveWidth_in: positiveNum,
    deckOrientation: z.enum(['perpendicular', 'parallel'], { error: 'must be "perpendicular" or "parallel"' }),
    studsPerRib: z.number().int({ error: 'must be 1, 2 or 3' }).min(1, { error: 'must be 1, 2 or 3' }).max(3, { error: 'must be 1, 2 or 3' }).default(1),
    studs: z.number().int({ error: 'must be a whole number or null' }).nonnegative({ error: 'must be a whole number ≥ 0 or null' }).nullable().default(null),
    shored: z.boolean({ error: 'must be true or false' }).default(false),
    constructionLoads: z.array(memberLoadSchema, { error: 'must be a list of loads' }).default([]),
    constructionBracing: bracingSchema.optional(),
    studDiameter_in: positiveNum.max(1, { error: 'must be at most 1 in' }).optional(),
    studFu_ksi: positiveNum.optional(),
    minPercentComposite: num.min(0, { error: 'must be between 0 and 1' }).max(1, { error: 'must be between 0 and 1' }).optional(),
    camber: z.boolean({ error: 'must be true or false' }).optional(),
    studEquivalentWeight_lb: num.nonnegative({ error: 'must be a number ≥ 0' }).optional(),
    emidHt_in: positiveNum.nullable().optional(),
  })
  .strict()
  .superRefine((c, ctx) => {
    if (c.slab.ribAvgWidth_in > c.slab.ribSpacing_in) ctx.addIssue({ code: 'custom', path: ['slab', 'ribAvgWidth_in'], message: 'must not exceed ribSpacing_in' });
  });

export const memberDesignInputSchema = z
  .object({
    span_ft: num,
    loads: z.array(memberLoadSchema, { error: 'must be a list of loads' }),
    bracing: bracingSchema,
    method: z.enum(['LRFD', 'ASD'], { error: 'must be LRFD or ASD' }),
    Fy_ksi: num.default(50),
    deflectionLimits: z
      .object({ live: num.nullable(), total: num.nullable() }, { error: 'must be { "live": n or null, "total": n or null }' })
      .default({ live: 360, total: 240 }),
    shape: z.string({ error: 'must be a W-shape label such as "W18X50" or null' }).nullable().optional(),
    maxDepth_in: num.nullable().optional(),
    minDepth_in: num.nullable().optional(),
    allowedNominalDepths: z.array(num).nullable().optional(),
    includeSelfWeight: z.boolean({ error: 'must be true or false' }).default(true),
    Lb_override_ft: num.nullable().optional(),
    liveLoadFactorHalf: z.boolean({ error: 'must be true or false' }).optional(),
    totalDeflectionIncludes: z.enum(['deadAndLive', 'superimposedDeadAndLive'], { error: 'must be "deadAndLive" or "superimposedDeadAndLive"' }).optional(),
    preCompositeDead: z.array(memberLoadSchema, { error: 'must be a list of loads' }).nullable().optional(),
    composite: compositeMemberInputSchema.nullable().optional(),
  })
  .strict()
  .superRefine((input, ctx) => {
    for (const p of memberInputProblems(input as MemberDesignInput)) {
      ctx.addIssue({ code: 'custom', path: p.path, message: p.message });
    }
  });

export type MemberDesignInputParsed = z.infer<typeof memberDesignInputSchema>;

export type MemberParseResult =
  | { ok: true; input: MemberDesignInput }
  | { ok: false; problems: string[] };

/** Parses unknown JSON into a member design input, or lists every problem as "path: message". */
export function parseMemberInput(json: unknown): MemberParseResult {
  const r = memberDesignInputSchema.safeParse(json);
  if (r.success) return { ok: true, input: r.data as MemberDesignInput };
  const problems: string[] = [];
  const paths = new Set<string>();
  for (const issue of r.error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) problems.push(`${formatProblemPath([...issue.path, key])}: unknown field`);
      continue;
    }
    const path = formatProblemPath(issue.path);
    paths.add(path);
    problems.push(`${path}: ${issue.message}`);
  }
  // zod skips refinements once a type is wrong; still report the span and catalog rules
  // (the engine's checks are written to accept any JSON) for fields zod did not flag.
  if (json !== null && typeof json === 'object' && !Array.isArray(json)) {
    const raw = { Fy_ksi: 50, includeSelfWeight: true, deflectionLimits: { live: null, total: null }, ...(json as object) };
    for (const p of memberInputProblems(raw as MemberDesignInput)) {
      const path = formatProblemPath(p.path);
      if (![...paths].some((q) => path === q || path.startsWith(`${q}.`) || path.startsWith(`${q}[`) || q.startsWith(`${path}.`) || q.startsWith(`${path}[`))) {
        problems.push(`${path}: ${p.message}`);
      }
    }
  }
  return { ok: false, problems };
}
