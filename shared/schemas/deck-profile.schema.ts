/**
 * Slab build-ups on fluted deck that a deck is set from: a small built-in library of common
 * profiles under Baywright's own names (numbers of our own, common practice; not a maker's
 * catalogue), and the firm's own profiles stored server-side. The zod schema names the field
 * in every message; the same schema checks a deck's slab typed on the Plan.
 */
import { z } from 'zod';

const num = (label: string, unit: string, min: number, max: number, opts: { exclusiveMin?: boolean } = {}) =>
  z
    .number({ error: `${label} must be a number in ${unit}` })
    .refine(Number.isFinite, { error: `${label} must be a number in ${unit}` })
    .refine((v) => (opts.exclusiveMin ? v > min : v >= min) && v <= max, {
      error: opts.exclusiveMin ? `${label} must be more than ${min} and at most ${max} ${unit}` : `${label} must be between ${min} and ${max} ${unit}`,
    });

/** Bounds wide enough for any composite floor of rolled deck (common practice), tight enough to catch a slip of the unit. */
export const DECK_SLAB_BOUNDS = {
  ribHeight_in: { label: 'Rib height', unit: 'in', min: 0.5, max: 8 },
  toppingThickness_in: { label: 'Topping above the ribs', unit: 'in', min: 1, max: 12 },
  ribAvgWidth_in: { label: 'Average rib width', unit: 'in', min: 0.5, max: 24 },
  ribSpacing_in: { label: 'Rib spacing', unit: 'in', min: 1, max: 36 },
  concreteWeight_pcf: { label: 'Concrete unit weight', unit: 'pcf', min: 90, max: 160 },
  fc_ksi: { label: "f'c", unit: 'ksi', min: 2.5, max: 10 },
  deckWeight_psf: { label: 'Deck weight', unit: 'psf', min: 0, max: 15 },
} as const;
export type DeckSlabField = keyof typeof DECK_SLAB_BOUNDS;
export const DECK_SLAB_FIELDS = Object.keys(DECK_SLAB_BOUNDS) as DeckSlabField[];

const b = DECK_SLAB_BOUNDS;
export const deckSlabSchema = z
  .object({
    ribHeight_in: num(b.ribHeight_in.label, b.ribHeight_in.unit, b.ribHeight_in.min, b.ribHeight_in.max),
    toppingThickness_in: num(b.toppingThickness_in.label, b.toppingThickness_in.unit, b.toppingThickness_in.min, b.toppingThickness_in.max),
    ribAvgWidth_in: num(b.ribAvgWidth_in.label, b.ribAvgWidth_in.unit, b.ribAvgWidth_in.min, b.ribAvgWidth_in.max),
    ribSpacing_in: num(b.ribSpacing_in.label, b.ribSpacing_in.unit, b.ribSpacing_in.min, b.ribSpacing_in.max),
    concreteWeight_pcf: num(b.concreteWeight_pcf.label, b.concreteWeight_pcf.unit, b.concreteWeight_pcf.min, b.concreteWeight_pcf.max),
    fc_ksi: num(b.fc_ksi.label, b.fc_ksi.unit, b.fc_ksi.min, b.fc_ksi.max),
    deckWeight_psf: num(b.deckWeight_psf.label, b.deckWeight_psf.unit, b.deckWeight_psf.min, b.deckWeight_psf.max),
  })
  .refine((s) => s.ribAvgWidth_in <= s.ribSpacing_in, { message: 'Average rib width must not exceed the rib spacing', path: ['ribAvgWidth_in'] });
export type DeckSlab = z.infer<typeof deckSlabSchema>;

export const deckProfileBody = z.object({
  name: z
    .string({ error: 'Name is required' })
    .trim()
    .min(1, 'Name is required')
    .max(120, 'Name is at most 120 characters')
    // A name shown in a picker and printed on sheets: no control characters (PostgreSQL text
    // cannot even hold NUL, so it would not come back as sent).
    .regex(/^[^\u0000-\u001f\u007f]+$/, 'Name cannot hold control characters'),
  slab: deckSlabSchema,
});
export type DeckProfileInput = z.infer<typeof deckProfileBody>;

/** A rename only: the profile's build-up stays as stored, whatever the renaming client last read. */
export const deckProfileRenameBody = deckProfileBody.pick({ name: true });
export type DeckProfileRename = z.infer<typeof deckProfileRenameBody>;

export interface DeckProfile {
  /** "builtin:…" for the built-in library, a UUID for the firm's own. */
  id: string;
  name: string;
  slab: DeckSlab;
  builtIn: boolean;
}

/**
 * Built-in profiles, Baywright's own names; the figures are typical of the trade (common
 * practice, recalled from memory, not a maker's catalogue): deck weights about 1.7–2.5 psf for
 * 20 ga, ribs of 3 in deck about 6 in wide on average at 12 in.
 */
export const BUILT_IN_DECK_PROFILES: readonly DeckProfile[] = [
  {
    id: 'builtin:3in-20ga-lw',
    name: '3 in composite deck, 20 ga, lightweight concrete, 3¼ in topping',
    slab: { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 114, fc_ksi: 3.5, deckWeight_psf: 2.5 },
    builtIn: true,
  },
  {
    id: 'builtin:3in-20ga-nw',
    name: '3 in composite deck, 20 ga, normal-weight concrete, 3½ in topping',
    slab: { ribHeight_in: 3, toppingThickness_in: 3.5, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 145, fc_ksi: 4, deckWeight_psf: 2.5 },
    builtIn: true,
  },
  {
    id: 'builtin:2in-20ga-nw',
    name: '2 in composite deck, 20 ga, normal-weight concrete, 3½ in topping',
    slab: { ribHeight_in: 2, toppingThickness_in: 3.5, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 145, fc_ksi: 3, deckWeight_psf: 2 },
    builtIn: true,
  },
  {
    id: 'builtin:1.5in-20ga-nw',
    name: '1½ in composite deck, 20 ga, normal-weight concrete, 2½ in topping',
    slab: { ribHeight_in: 1.5, toppingThickness_in: 2.5, ribAvgWidth_in: 3.5, ribSpacing_in: 6, concreteWeight_pcf: 145, fc_ksi: 3, deckWeight_psf: 1.7 },
    builtIn: true,
  },
];
