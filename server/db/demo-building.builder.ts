import { PLAN_FORMAT, type Plan, type PlanMember, type PlanPolygon, type PlanSlab } from '../../shared/schemas/plan.schema';

/**
 * The demo floors' slab (numbers of our own): lightweight concrete, 114 pcf, f'c = 3.5 ksi,
 * 3¼ in. over a 3 in. deck with 6 in. average ribs at 12 in.: 114 × (3.25 + 3 × 6/12) / 12 = 45.1 psf concrete + 2.5 psf deck = 47.6 psf.
 */
export const DEMO_SLAB: PlanSlab = {
  ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12,
  concreteWeight_pcf: 114, fc_ksi: 3.5, deckWeight_psf: 2.5, profile: 'BW-3.0-12',
};

/** The member the demo keeps non-composite on purpose (beside the stair, the engineer's choice). */
export const DEMO_NON_COMPOSITE_MEMBER = 'L2-BC45';

// A small parametric builder for the demo building (an invented clinic of Baywright's own):
// a rectangular grid of bays, columns at every intersection through every level, girders on
// the numbered grid lines, beams on the lettered grid lines and infill beams between them
// at a chosen spacing, deck spanning onto the beams, load zones, cladding, equipment and a
// stair opening. Two schemes differ only in beamSpacing_ft.

export interface DemoBuildingOptions {
  name: string;
  /** Target spacing of the infill beams; each bay gets round(bay / spacing) equal spaces. */
  beamSpacing_ft: number;
}

/** Bay widths along x (grid lines 1…5) and along y (grid lines A…D), ft. Invented. */
export const DEMO_BAYS_X_FT = [30, 30, 30, 30] as const;
export const DEMO_BAYS_Y_FT = [30, 28, 32] as const;

export const DEMO_LEVELS = [
  { id: 'L2', name: 'Level 2', elevation_ft: 15 },
  { id: 'L3', name: 'Level 3', elevation_ft: 29 },
  { id: 'L4', name: 'Level 4', elevation_ft: 43 },
  { id: 'R', name: 'Roof', elevation_ft: 57, roof: true },
] as const;

const FLOORS = ['L2', 'L3', 'L4'] as const;
const LETTERS = 'ABCDEFGH';

/** Running sums: grid offsets from bay widths. */
function offsets(bays: readonly number[]): number[] {
  const out = [0];
  for (const b of bays) out.push(out[out.length - 1] + b);
  return out;
}

const rect = (x0: number, y0: number, x1: number, y1: number): PlanPolygon => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

const round = (v: number) => Math.round(v * 1000) / 1000;

/** y of the beam lines of a bay, both grid lines included: round(bay / spacing) equal spaces. */
export function framingLinesY(y0: number, y1: number, spacingFt: number): number[] {
  const spaces = Math.max(1, Math.round((y1 - y0) / spacingFt));
  return Array.from({ length: spaces + 1 }, (_, k) => (k === spaces ? y1 : round(y0 + (k * (y1 - y0)) / spaces)));
}

export function buildDemoBuildingPlan(options: DemoBuildingOptions): Plan {
  const xs = offsets(DEMO_BAYS_X_FT);
  const ys = offsets(DEMO_BAYS_Y_FT);
  const width = xs[xs.length - 1];
  const depth = ys[ys.length - 1];
  const levels = DEMO_LEVELS.map((l) => ({ ...l }));
  const levelIds = levels.map((l) => l.id);

  const grids = [
    ...xs.map((x, i) => ({ id: `grid-${i + 1}`, axis: 'x' as const, label: String(i + 1), offset_ft: x })),
    ...ys.map((y, j) => ({ id: `grid-${LETTERS[j]}`, axis: 'y' as const, label: LETTERS[j], offset_ft: y })),
  ];

  const columns = ys.flatMap((y, j) =>
    xs.map((x, i) => ({ id: `C-${LETTERS[j]}${i + 1}`, x_ft: x, y_ft: y, levels: [...levelIds] })),
  );

  const members: PlanMember[] = [];
  const member = (id: string, level: string, kind: 'girder' | 'beam', start: [number, number], end: [number, number]) =>
    members.push({ id, level, kind, start, end, shape: null, maxDepth_in: null });

  for (const level of levelIds) {
    // Girders on the numbered grid lines, column to column, spanning y.
    xs.forEach((x, i) => {
      for (let j = 0; j < ys.length - 1; j++) {
        member(`${level}-G${i + 1}${LETTERS[j]}${LETTERS[j + 1]}`, level, 'girder', [x, ys[j]], [x, ys[j + 1]]);
      }
    });
    // Beams on the lettered grid lines, column to column, spanning x.
    ys.forEach((y, j) => {
      for (let i = 0; i < xs.length - 1; i++) {
        member(`${level}-B${LETTERS[j]}${i + 1}${i + 2}`, level, 'beam', [xs[i], y], [xs[i + 1], y]);
      }
    });
    // Infill beams between the lettered lines, girder to girder.
    for (let j = 0; j < ys.length - 1; j++) {
      framingLinesY(ys[j], ys[j + 1], options.beamSpacing_ft).slice(1, -1).forEach((y, k) => {
        for (let i = 0; i < xs.length - 1; i++) {
          member(`${level}-B${i + 1}${i + 2}-${LETTERS[j]}${k + 1}`, level, 'beam', [xs[i], y], [xs[i + 1], y]);
        }
      });
    }
  }

  // Load zones (ASCE 7-16 Table 4.3-1 live loads; partitions per §4.3.2; dead loads are our
  // invented build-up: 3¼ in. lightweight concrete on 3 in. deck ≈ 50 psf).
  const zones = [
    { id: 'office', name: 'Exam rooms and offices', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 15, live_psf: 50, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
    { id: 'corridor', name: 'Corridor above the first floor', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 15, live_psf: 80, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
    // Over 100 psf: not reduced (ASCE 7-16 §4.7.3).
    { id: 'mechanical', name: 'Mechanical room', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 0, live_psf: 125, liveReducible: false, roofLive_psf: 0, snow_psf: 0 },
    // Invented site: pg = 30 psf, Ce = Ct = Is = 1.0; pf = 0.7·Ce·Ct·Is·pg = 21 psf (ASCE 7-16 Eq. 7.3-1).
    { id: 'roof', name: 'Roof', dead_psf: 15, superimposedDead_psf: 12, partition_psf: 0, live_psf: 0, liveReducible: false, roofLive_psf: 20, snow_psf: 21 },
  ];

  // Corridor: the infill space of bay B–C that holds the bay's centre line (the space above
  // it when a beam sits on the centre line). Zones are drawn to framing lines because each
  // deck area spans between the members inside it.
  const corridorLines = framingLinesY(ys[1], ys[2], options.beamSpacing_ft);
  const centreY = (ys[1] + ys[2]) / 2;
  const corridorIndex = corridorLines.findIndex((y, k) => k + 1 < corridorLines.length && y <= centreY && centreY < corridorLines[k + 1]);
  const corridorY0 = corridorLines[corridorIndex];
  const corridorY1 = corridorLines[corridorIndex + 1];
  const decks: Plan['decks'] = [];
  for (const level of FLOORS) {
    decks.push({ id: `${level}-deck-south`, level, polygon: rect(0, 0, width, corridorY0), spanDirection: 'y', zone: 'office' });
    decks.push({ id: `${level}-deck-corridor`, level, polygon: rect(0, corridorY0, width, corridorY1), spanDirection: 'y', zone: 'corridor' });
    if (level === 'L4') {
      // Mechanical room over bay 1–2 / C–D.
      decks.push({ id: `${level}-deck-north`, level, polygon: [[0, corridorY1], [width, corridorY1], [width, depth], [xs[1], depth], [xs[1], ys[2]], [0, ys[2]]], spanDirection: 'y', zone: 'office' });
      decks.push({ id: `${level}-deck-mechanical`, level, polygon: rect(0, ys[2], xs[1], depth), spanDirection: 'y', zone: 'mechanical' });
    } else {
      decks.push({ id: `${level}-deck-north`, level, polygon: rect(0, corridorY1, width, depth), spanDirection: 'y', zone: 'office' });
    }
  }
  decks.push({ id: 'R-deck', level: 'R', polygon: rect(0, 0, width, depth), spanDirection: 'y', zone: 'roof' });
  // Floors: concrete on deck, designed composite; the roof is bare deck and stays bare steel.
  for (const d of decks) if (d.level !== 'R') d.slab = { ...DEMO_SLAB };
  const nonComposite = members.find((m) => m.id === DEMO_NON_COMPOSITE_MEMBER);
  if (nonComposite) nonComposite.composite = false;

  // Cladding on the perimeter, one line load per bay so each lies along one member:
  // metal panel on studs, about 20 psf × 14 ft storey ≈ 0.28 klf (floors); parapet 0.15 klf (roof).
  const lineLoads: Plan['lineLoads'] = [];
  for (const level of levelIds) {
    const D_klf = level === 'R' ? 0.15 : 0.28;
    const edge = (tag: string, start: [number, number], end: [number, number]) =>
      lineLoads.push({ id: `${level}-clad-${tag}`, level, start, end, D_klf, L_klf: 0 });
    for (let i = 0; i < xs.length - 1; i++) {
      edge(`A${i + 1}${i + 2}`, [xs[i], 0], [xs[i + 1], 0]);
      edge(`${LETTERS[ys.length - 1]}${i + 1}${i + 2}`, [xs[i], depth], [xs[i + 1], depth]);
    }
    for (let j = 0; j < ys.length - 1; j++) {
      edge(`1${LETTERS[j]}${LETTERS[j + 1]}`, [0, ys[j]], [0, ys[j + 1]]);
      edge(`${xs.length}${LETTERS[j]}${LETTERS[j + 1]}`, [width, ys[j]], [width, ys[j + 1]]);
    }
  }

  const pointLoads: Plan['pointLoads'] = [
    // Rooftop unit on its curb over bay 2–3 / B–C: about 8 kip operating, two rails.
    { id: 'R-rtu-west', level: 'R', x_ft: 44, y_ft: ys[1] + 10, D_kip: 4, L_kip: 0 },
    { id: 'R-rtu-east', level: 'R', x_ft: 52, y_ft: ys[1] + 10, D_kip: 4, L_kip: 0 },
    // Imaging equipment in an exam room on level 2 (invented: 3 kip).
    { id: 'L2-imaging', level: 'L2', x_ft: 75, y_ft: 15, D_kip: 3, L_kip: 0 },
  ];

  // Stair in bay 4–5 / C–D, between the grid line and the first infill beam of either scheme.
  const stairY0 = ys[2] + 1;
  const openings: Plan['openings'] = FLOORS.map((level) => ({
    id: `${level}-stair`,
    level,
    polygon: rect(xs[3] + 4, stairY0, xs[3] + 24, stairY0 + 5.5),
  }));

  return {
    format: PLAN_FORMAT,
    version: 2,
    name: options.name,
    designBasis: {
      method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 },
      composite: { enabled: true, studDiameter_in: 0.75, studFu_ksi: 65, minPercentComposite: 0.25, constructionLive_psf: 20, shored: false, camber: true, studEquivalentWeight_lb: 10 },
    },
    grids,
    levels,
    columns,
    members,
    zones,
    decks,
    pointLoads,
    lineLoads,
    openings,
  };
}
