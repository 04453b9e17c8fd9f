/**
 * Calc book: the printable calculation report of a scheme, as a document model (sections of
 * headings, paragraphs, lists and tables) built from the plan and its designScheme result.
 * Pure: the PDF renderer (server/pdf/calc-book.pdf.ts) only lays it out, so everything the
 * report states is testable here. Numbers stay numbers (CalcNumber) until they are drawn.
 */
import { E_KSI, STANDARDS, memberBracingSource, memberDeflectionLimits } from '../engine/index';
import type { MemberCheck, MemberLoad, SchemeMember, SchemeResult } from '../engine/index';
import type { Plan } from '../schemas/plan.schema';
import { describeProblem, planNamer, type PlanNamer } from '../drafting/element-names.drafting';
import { describeLoadSource } from '../drafting/load-source.drafting';
import { gridIntersectionLabel, gridLocation } from '../drafting/grid-location.drafting';

/**
 * Names for the book's sentences: members by kind, mark and grid location, columns by grid
 * intersection, levels and zones by name (issue 16 item 11: no internal ids in what a person reads).
 */
interface BookNames extends PlanNamer {
  /** "column at B2" or "beam 2B1 at A–B / 1" for a support id. */
  support(id: string): string;
  /** A member's place on the grid ("A–B / 1"), else its kind and mark. */
  where(id: string): string;
  /** A column by its grid intersection. */
  column(id: string): string;
}

function bookNames(plan: Plan, design: Pick<SchemeResult, 'members'>): BookNames {
  const base = planNamer(plan, new Map((design.members ?? []).map((m) => [m.id, m.mark])));
  const members = new Map(plan.members.map((m) => [m.id, m]));
  const columns = new Map(plan.columns.map((c) => [c.id, c]));
  const column = (id: string) => {
    const c = columns.get(id);
    if (!c) return 'a column';
    const at = gridIntersectionLabel(c.x_ft, c.y_ft, plan.grids);
    return at ? `column at ${at}` : `column at (${c.x_ft.toFixed(1)}, ${c.y_ft.toFixed(1)}) ft`;
  };
  return {
    ...base,
    column,
    support: (id) => (columns.has(id) ? column(id) : (base.member(id) ?? 'a member')),
    where(id) {
      const m = members.get(id);
      if (!m) return '—';
      return gridLocation(m.start, m.end, plan.grids) ?? `(${m.start[0].toFixed(1)}, ${m.start[1].toFixed(1)})–(${m.end[0].toFixed(1)}, ${m.end[1].toFixed(1)}) ft`;
    },
  };
}

/** The notice on the cover and on every page of the calc book (product.md, Cautions). */
export const CALC_BOOK_CAUTION =
  'Results are an aid to a licensed engineer, who must check them; the local building code and the engineer of record govern.';

/** Code editions the engine implements (design-basis.md), cited as the report states them. */
export const CODE_EDITIONS: readonly { code: string; scope: string }[] = [
  { code: 'AISC 360-16', scope: 'Specification for Structural Steel Buildings: flexure (Chapter F), shear (Chapter G), Table B4.1b slenderness' },
  { code: 'ASCE 7-16 §2.3.1', scope: 'Load combinations for strength design (LRFD)' },
  { code: 'ASCE 7-16 §2.4.1', scope: 'Load combinations for allowable stress design (ASD)' },
  { code: 'ASCE 7-16 §4.7', scope: 'Reduction in uniformly distributed live loads (Eq. 4.7-1, Table 4.7-1)' },
  { code: 'IBC Table 1604.3', scope: 'Deflection limits (serviceability, unfactored loads)' },
  { code: 'AISC Shapes Database v15.0', scope: 'W-shape dimensions and properties' },
];

/** What the engine assumes, and where it takes the conservative reading of a clause. */
export const ENGINE_ASSUMPTIONS: readonly string[] = [
  'Members are simple spans with pinned (shear-connected) ends; no continuity, cantilevers or back-spans.',
  'LRFD combinations 3 and 4 of ASCE 7-16 §2.3.1 use 1.0L; the 0.5L of exception 1 is not taken (conservative).',
  'Roof live load is not reduced (ASCE 7-16 §4.8.2 not applied; conservative), and live load on roof levels is not reduced by §4.7.',
  'Partition load is treated as live load and never reduced. Live loads over 100 psf are not reduced (§4.7.3); the 20 % allowance for members supporting two or more floors is not taken (conservative).',
  'The tributary area AT of a girder is the floor area whose load it actually carries, traced through the framing (the beams pass their reactions in proportion). This is smaller than "girder span × half the beam spans", so it reduces less (conservative reading of ASCE 7-16 §4.7).',
  'Columns: live load reduced on the cumulative tributary area with KLL = 4 (Table 4.7-1), and L ≥ 0.40 L0 once two or more floors contribute.',
  'Columns are pinned gravity columns sized by AISC 360-16 Chapter E (E3, E7) with Lc = storey height and K = 1.0. The column\'s own weight down to each length is added to Pr as dead load. Every length of a tier is checked with its own Pr and Lc. A splice is taken at the floor, so the storey above it is checked with the upper, lighter tier\'s shape over its whole height; a level the column passes without framing lengthens the piece (no brace there). Lc/r ≤ 200 (the User Note of E2) is taken as a limit when a size is chosen; a locked size over it is checked on strength and flagged. All conservative.',
  'Composite beams (AISC 360-16 Chapter I): the steel is idealised as two flanges and a web, fillets ignored (conservative for Mn); with deck ribs parallel to the beam the concrete compression block is full width only through the topping and continues into the ribs at their average width (I3.2c); with deck ribs perpendicular to the beam Rp = 0.6 unless the stud position in the rib (emid-ht) is given (I8.2a, conservative); the defaults of at least 25 % composite and a 20 psf construction live load (project settings), the construction stage on the bare steel braced only by perpendicular deck, and camber of 80 % of the pre-composite dead-load deflection rounded down to 1/4 in. (none below 3/4 in.) are common practice.',
  'The compression flange is braced continuously only where a deck spanning perpendicular to the member covers its whole span; otherwise it is braced at the points where other members frame in. Deck parallel to a member is not counted as bracing (bare-steel stage; conservative).',
  'Cb is computed by AISC 360-16 Eq. F1-1 from the member\'s own moment diagram for each segment and combination; where the engineer overrides Lb, Cb = 1.0 (conservative).',
  'Total-load deflection is computed under all load cases together (D + L + Lr + S), whatever the project\'s total-deflection setting (conservative).',
  'Member self weight is added as a uniform dead load from the chosen shape, and sizing is repeated until the shape no longer changes.',
];

export type CalcBookMembers = 'all' | 'distinct';

export interface CalcBookOptions {
  /** 'distinct' (default): one member per mark, the one that works hardest. */
  members?: CalcBookMembers;
  /** Only this level's members and columns. */
  levelId?: string;
}

export interface CalcBookInput {
  plan: Plan;
  design: SchemeResult;
  project: { name: string; number?: string | null; client?: string | null; address?: string | null };
  scheme: { name: string; revision: number };
  /** Plan revision the design was computed from, and when. */
  designedRevision?: number;
  designedAt?: string;
  /** Issue date, YYYY-MM-DD. */
  date: string;
  /** The scheme's engineer (who prepared the design), not whoever downloads the book. */
  preparedBy: string;
  /** Who downloaded this copy and when (ISO time), printed apart from "Prepared by". */
  downloadedBy?: { name: string; at: string };
  options?: CalcBookOptions;
}

/** A number kept as a number; `digits` decimals when drawn. */
export interface CalcNumber {
  n: number;
  digits: number;
}
export type CalcCell = string | CalcNumber | null;

export interface CalcColumn {
  label: string;
  /** Relative width. */
  weight: number;
  align?: 'left' | 'right';
}

export type CalcBlock =
  | { type: 'heading'; text: string }
  | { type: 'paragraph'; text: string; tone?: 'normal' | 'soft' | 'strong' }
  | { type: 'caution'; text: string }
  | { type: 'list'; items: string[] }
  | { type: 'fields'; rows: [string, CalcCell][] }
  | { type: 'table'; caption?: string; columns: CalcColumn[]; rows: CalcCell[][] };

export interface CalcSection {
  /** Stable id: "cover", "attention", "basis", "zones", "level-L2", "member-b2", "columns", "equilibrium". */
  id: string;
  title: string;
  blocks: CalcBlock[];
  /** Member sections: which member and mark. */
  memberId?: string;
  mark?: string;
  /** Start a new page before this section. */
  pageBreakBefore?: boolean;
}

export interface CalcBook {
  title: string;
  caution: string;
  /** Every distinct mark in the report, in mark order. */
  marks: string[];
  sections: CalcSection[];
  /** Short running text for page footers. */
  runningTitle: string;
}

const num = (n: number, digits: number): CalcNumber => ({ n, digits });
const opt = (n: number | null | undefined, digits: number): CalcCell => (n === null || n === undefined || !Number.isFinite(n) ? null : num(n, digits));

/** Formats a CalcNumber as the report prints it (thousands separated). */
export function formatCalcNumber(c: CalcNumber): string {
  const v = Object.is(Math.round(c.n * 10 ** c.digits), -0) ? 0 : c.n;
  return v.toLocaleString('en-US', { minimumFractionDigits: c.digits, maximumFractionDigits: c.digits });
}

/** The text a cell prints. */
export function cellText(c: CalcCell): string {
  if (c === null) return '—';
  return typeof c === 'string' ? c : formatCalcNumber(c);
}

const byMark = new Intl.Collator('en-US', { numeric: true, sensitivity: 'base' });

/** Marks in drafting order: level prefix and number compared as numbers (2B2 before 2B10). */
export function compareMarks(a: string, b: string): number {
  return byMark.compare(a, b);
}

const CHECK_TITLE: Record<string, string> = {
  flexure: 'Flexure',
  shear: 'Shear',
  deflectionLive: 'Live-load deflection',
  deflectionTotal: 'Total-load deflection',
};

/** Members that fail a check, could not be designed or have a plan problem against them. */
function attentionReasons(m: SchemeMember, problems: SchemeResult['problems'], names: BookNames): string[] {
  const reasons: string[] = [];
  if (!m.design) reasons.push('not designed');
  else if (!m.design.passes) reasons.push(m.design.failure ?? `${CHECK_TITLE[m.design.governing] ?? m.design.governing} ratio ${m.design.ratio.toFixed(3)} > 1.0`);
  for (const p of problems ?? []) {
    if (p.elementId !== m.id) continue;
    // The engine's own "member fails" problem repeats the failure reason above.
    if (p.code === 'member-fails' && m.design && !m.design.passes) continue;
    reasons.push(`${p.severity}: ${describeProblem(p.message, names)}`);
  }
  if (reasons.length === 0 && !m.passes) reasons.push('does not pass');
  return reasons;
}

function describeBracing(m: SchemeMember, setOnMember = false): string {
  const b = m.bracing;
  if (b === 'continuous') return setOnMember ? 'continuous' : 'continuous (deck across the span)';
  if (b === 'none') return 'at the supports only';
  return b.points_ft.length === 0 ? 'at the supports only' : `at ${b.points_ft.map((x) => `${x.toFixed(2)} ft`).join(', ')}${setOnMember ? '' : ' (members framing in)'}`;
}

function loadRow(l: MemberLoad, names: BookNames): CalcCell[] {
  const src = describeLoadSource(l.source ?? '', null, names);
  switch (l.kind) {
    case 'uniform':
      return [l.case, 'uniform', num(l.w_klf, 3), 'klf', 'full span', src];
    case 'partial':
      return [l.case, 'partial uniform', num(l.w_klf, 3), 'klf', `${l.from_ft.toFixed(2)}–${l.to_ft.toFixed(2)} ft`, src];
    case 'linear':
      return [l.case, 'linear', num(l.w1_klf, 3), `→ ${l.w2_klf.toFixed(3)} klf`, `${l.from_ft.toFixed(2)}–${l.to_ft.toFixed(2)} ft`, src];
    case 'point':
      return [l.case, 'point', num(l.P_kip, 2), 'kip', `at ${l.x_ft.toFixed(2)} ft`, src];
  }
}

const resistance = (c: MemberCheck): string =>
  c.phi !== undefined ? `φ = ${c.phi.toFixed(2)} (LRFD)` : c.omega !== undefined ? `Ω = ${c.omega.toFixed(2)} (ASD)` : '—';

/** The key working of a check: quantity, value, unit, where it comes from. */
export function checkWorking(c: MemberCheck, limitRef = 'IBC Table 1604.3'): CalcCell[][] {
  const rows: CalcCell[][] = [];
  const add = (q: string, v: number | null | undefined, digits: number, unit: string, ref: string) => {
    if (v === undefined) return;
    rows.push([q, opt(v, digits), unit, ref]);
  };
  if (c.name === 'flexure') {
    if (c.from_ft !== undefined && c.to_ft !== undefined) rows.push(['Segment', `${c.from_ft.toFixed(2)}–${c.to_ft.toFixed(2)} ft`, '', 'governing unbraced segment']);
    add('λf = bf/2tf', c.lambda_f, 2, '', 'AISC 360-16 Table B4.1b, case 10');
    add('λpf', c.lambda_pf, 2, '', '0.38√(E/Fy)');
    add('λrf', c.lambda_rf, 2, '', '1.0√(E/Fy)');
    if (c.flangeClass) rows.push(['Flange', c.flangeClass, '', 'Table B4.1b']);
    add('λw = h/tw', c.lambda_w, 2, '', 'AISC 360-16 Table B4.1b, case 15');
    add('λpw', c.lambda_pw, 2, '', '3.76√(E/Fy)');
    add('Lp', c.Lp_ft, 2, 'ft', 'Eq. F2-5');
    add('Lr', c.Lr_ft, 2, 'ft', 'Eq. F2-6');
    add('Lb', c.Lb_ft, 2, 'ft', 'unbraced length');
    add('Cb', c.Cb, 3, '', 'Eq. F1-1');
    add('MA', c.MA_kipft, 1, 'kip-ft', 'quarter points, Eq. F1-1');
    add('MB', c.MB_kipft, 1, 'kip-ft', 'midpoint');
    add('MC', c.MC_kipft, 1, 'kip-ft', 'three-quarter point');
    add('Mp = Fy Zx', c.Mp_kipft, 1, 'kip-ft', 'Eq. F2-1');
    add('Fcr', c.Fcr_ksi, 2, 'ksi', 'Eq. F2-4 (only where Lb > Lr)');
    add('Mn (FLB)', c.Mn_FLB_kipft, 1, 'kip-ft', 'Eq. F3-1 (noncompact flange)');
    add('Mn', c.Mn_kipft, 1, 'kip-ft', `${c.equation}${c.limitState ? `, ${c.limitState}` : ''}`);
  } else if (c.name === 'shear') {
    add('Aw = d tw', c.Aw_in2, 2, 'in²', 'AISC 360-16 G2.1');
    add('h/tw', c.h_tw, 2, '', '');
    add('limit', c.h_tw_limit, 2, '', c.shearCase === 'G2.1(a)' ? '2.24√(E/Fy), G2.1(a)' : '1.10√(kv E/Fy), Eq. G2-3');
    if (c.kv !== undefined && c.kv !== null) add('kv', c.kv, 2, '', 'G2.1(b)(2), no stiffeners');
    add('Cv1', c.Cv1, 3, '', c.shearCase === 'G2.1(a)' ? 'G2.1(a)' : 'Eq. G2-3 / G2-4');
    add('Vn = 0.6 Fy Aw Cv1', c.Vn_kip, 1, 'kip', 'Eq. G2-1');
  } else {
    add('Ix', c.Ix_in4, 0, 'in⁴', 'AISC Shapes Database v15.0');
    add('Limit span/n, n', c.limit_n, 0, '', limitRef);
    add('Maximum at', c.at_ft, 2, 'ft', 'from the start support');
    if (c.loadCase) rows.push(['Loads', c.loadCase, '', 'unfactored']);
  }
  if (c.phi !== undefined || c.omega !== undefined) rows.push(['Resistance', resistance(c), '', c.name === 'shear' ? 'AISC 360-16 G1, G2.1' : 'AISC 360-16 F1']);
  return rows;
}

/** Where a member's deflection limits come from (the design basis unless set on the member). */
function limitRefs(plan: Plan, memberId: string): { live: string; total: string } {
  const pm = plan.members.find((x) => x.id === memberId);
  const used = memberDeflectionLimits(plan.designBasis, { deflectionLimits: pm?.deflectionLimits ?? null });
  const ref = (s: 'member' | 'basis') => (s === 'member' ? 'set on this member' : 'design basis (IBC Table 1604.3 defaults)');
  return { live: ref(used.source.live), total: ref(used.source.total) };
}

function memberSection(m: SchemeMember, others: string[], levelName: string, reasons: string[], names: BookNames, refs?: { live: string; total: string }): CalcSection {
  const d = m.design;
  const title = `${m.mark} — ${m.shape ?? 'no shape'} (${m.kind} at ${names.where(m.id)})`;
  const blocks: CalcBlock[] = [];
  if (reasons.length > 0) blocks.push({ type: 'caution', text: `Needs attention: ${reasons.join('; ')}` });
  blocks.push({
    type: 'fields',
    rows: [
      ['Level', levelName],
      ['Span, ft', num(m.span_ft, 2)],
      ['Shape', d ? `${d.shape}${d.locked ? ' (locked)' : ' (selected, lightest passing)'}` : (m.shape ?? '—')],
      ['Self weight, plf', num(m.weight_plf, 0)],
      ...(d?.composite
        ? ([
          ['Composite (AISC 360-16 Chapter I)', `${d.composite.studs} studs ${d.composite.studDiameter_in} in, ${Math.round(d.composite.percentComposite * 100)} % composite, PNA in the ${d.composite.PNA}`],
          ['Effective width b, in (I3.1a)', num(d.composite.effectiveWidth_in, 1)],
          ['Qn per stud, kip (Eq. I8-1)', `${cellText(num(d.composite.Qn_kip, 2))} (${d.composite.RgRpBasis})`],
          ['ΣQn, kip; Y2, in', `${cellText(num(d.composite.sumQn_kip, 1))}; ${cellText(num(d.composite.Y2_in, 2))}`],
          ['I_LB, in⁴ (Commentary Eq. C-I3-1)', num(d.composite.Ilb_in4, 0)],
          ['Construction stage (bare steel)', `Mr ${cellText(num(d.composite.construction.Mr_kipft, 1))} / Mc ${cellText(num(d.composite.construction.Mc_kipft, 1))} kip-ft (${d.composite.construction.combination}, ${d.composite.construction.clause}), ratio ${cellText(num(d.composite.construction.ratio, 3))}`],
          ['Wet-concrete deflection, in; camber, in', `${cellText(num(d.composite.preCompositeDeflection_in, 2))}; ${d.composite.camber_in > 0 ? cellText(num(d.composite.camber_in, 2)) : 'none'} (${d.composite.camberBasis})`],
        ] as [string, CalcCell][])
        : m.compositeNote ? ([['Composite', `no: ${m.compositeNote}`]] as [string, CalcCell][]) : []),
      ['Tributary width, ft', num(m.tributaryWidth_ft, 2)],
      ['Tributary area, ft²', num(m.tributaryArea_ft2, 1)],
      ['AT for live load reduction, ft²', num(m.reducibleArea_ft2, 1)],
      ['KLL (ASCE 7-16 Table 4.7-1)', num(m.KLL, 0)],
      ['Live load reduction factor (Eq. 4.7-1)', num(m.liveReductionFactor, 3)],
      ['Compression flange braced', describeBracing(m)],
      ...(others.length > 0 ? ([['Same mark, not printed', others.map((id) => names.where(id)).join('; ')]] as [string, CalcCell][]) : []),
    ],
  });
  blocks.push({
    type: 'table',
    caption: 'Loads (unfactored; reducible live already reduced)',
    columns: [
      { label: 'Case', weight: 0.6 },
      { label: 'Kind', weight: 1.3 },
      { label: 'Value', weight: 0.9, align: 'right' },
      { label: 'Unit', weight: 1 },
      { label: 'Where', weight: 1.3 },
      { label: 'Source', weight: 4 },
    ],
    rows: m.loads.map((l) => loadRow(l, names)),
  });
  if (!d) {
    blocks.push({ type: 'paragraph', text: 'This member could not be designed; see Needs attention.', tone: 'strong' });
    return { id: `member-${m.id}`, title, blocks, memberId: m.id, mark: m.mark };
  }
  blocks.push({ type: 'paragraph', text: `Combinations considered (${d.method}): ${d.combinations.map((c) => `${c.name} [${c.clause}]`).join('; ')}.`, tone: 'soft' });
  blocks.push({
    type: 'table',
    caption: 'Unbraced segments (flexure)',
    columns: [
      { label: 'From–to, ft', weight: 1.4 },
      { label: 'Lb, ft', weight: 0.9, align: 'right' },
      { label: 'Cb', weight: 0.8, align: 'right' },
      { label: 'Combination', weight: 1.6 },
      { label: 'Mr, kip-ft', weight: 1.1, align: 'right' },
      { label: 'Mc, kip-ft', weight: 1.1, align: 'right' },
      { label: 'Mn, kip-ft', weight: 1.1, align: 'right' },
      { label: 'Ratio', weight: 0.8, align: 'right' },
    ],
    rows: d.segments.map((s) => [
      `${s.from_ft.toFixed(2)}–${s.to_ft.toFixed(2)}`,
      num(s.Lb_ft, 2),
      num(s.Cb, 3),
      s.combination,
      num(s.Mr_kipft, 1),
      num(s.Mc_kipft, 1),
      num(s.Mn_kipft, 1),
      num(s.ratio, 3),
    ]),
  });
  blocks.push({
    type: 'table',
    caption: `Checks (${d.method === 'LRFD' ? 'capacity = φRn' : 'capacity = Rn/Ω'}; deflection capacity = span/n)`,
    columns: [
      { label: 'Check', weight: 1.5 },
      { label: 'Clause', weight: 1.9 },
      { label: 'Equation', weight: 1.6 },
      { label: 'Combination', weight: 1.3 },
      { label: 'Demand', weight: 0.9, align: 'right' },
      { label: 'Capacity', weight: 0.9, align: 'right' },
      { label: 'Unit', weight: 0.7 },
      { label: 'Ratio', weight: 0.7, align: 'right' },
    ],
    rows: d.checks.map((c) => [
      CHECK_TITLE[c.name] ?? c.name,
      c.clause,
      c.equation,
      c.combination,
      num(c.demand, c.unit === 'in' ? 3 : 1),
      num(c.capacity, c.unit === 'in' ? 3 : 1),
      c.unit,
      num(c.ratio, 3),
    ]),
  });
  for (const c of d.checks) {
    const rows = checkWorking(c, c.name === 'deflectionLive' ? refs?.live : c.name === 'deflectionTotal' ? refs?.total : undefined);
    if (rows.length === 0) continue;
    blocks.push({
      type: 'table',
      caption: `Working — ${CHECK_TITLE[c.name] ?? c.name} (${c.clause})`,
      columns: [
        { label: 'Quantity', weight: 1.8 },
        { label: 'Value', weight: 1.2, align: 'right' },
        { label: 'Unit', weight: 0.8 },
        { label: 'Reference', weight: 3 },
      ],
      rows,
    });
  }
  const gov = d.checks.find((c) => c.name === d.governing);
  blocks.push({
    type: 'paragraph',
    tone: 'strong',
    text: `Governing: ${CHECK_TITLE[d.governing] ?? d.governing}${gov ? ` (${gov.clause}, ${gov.combination})` : ''}, ratio ${d.ratio.toFixed(3)} — ${d.passes ? 'passes' : 'DOES NOT PASS'}.${d.failure ? ` ${d.failure}` : ''}`,
  });
  const end = (label: string, r: SchemeMember['reactions']['start']): CalcCell[] => [
    label,
    r.supportedBy ? names.support(r.supportedBy) : 'nothing',
    num(r.D_kip, 2),
    num(r.L_kip, 2),
    num(r.Lunreduced_kip, 2),
    num(r.Lr_kip, 2),
    num(r.S_kip, 2),
  ];
  blocks.push({
    type: 'table',
    caption: 'End reactions, unfactored, kip (with self weight)',
    columns: [
      { label: 'End', weight: 0.8 },
      { label: 'Supported by', weight: 1.5 },
      { label: 'D', weight: 1, align: 'right' },
      { label: 'L reduced', weight: 1, align: 'right' },
      { label: 'L unreduced', weight: 1, align: 'right' },
      { label: 'Lr', weight: 0.8, align: 'right' },
      { label: 'S', weight: 0.8, align: 'right' },
    ],
    rows: [end('start', m.reactions.start), end('end', m.reactions.end)],
  });
  return { id: `member-${m.id}`, title, blocks, memberId: m.id, mark: m.mark };
}

/** Ranks a member for "the one printed for its mark": failing or problem first, then the highest ratio. */
function workHarder(a: SchemeMember, b: SchemeMember): number {
  const fa = a.passes ? 0 : 1;
  const fb = b.passes ? 0 : 1;
  if (fa !== fb) return fb - fa;
  return (b.ratio ?? Infinity) - (a.ratio ?? Infinity) || a.id.localeCompare(b.id);
}

const deflLimit = (n: number | null) => (n === null ? 'not checked' : `span/${n}`);

export function buildCalcBook(input: CalcBookInput): CalcBook {
  const { plan, design, project, scheme } = input;
  const membersOption: CalcBookMembers = input.options?.members ?? 'distinct';
  const levelId = input.options?.levelId;
  const basis = plan.designBasis;
  const levelName = new Map(plan.levels.map((l) => [l.id, l.name] as const));
  const levels = plan.levels.filter((l) => levelId === undefined || l.id === levelId);
  const members = (design.members ?? []).filter((m) => levelId === undefined || m.level === levelId);
  const problems = design.problems ?? [];
  const names = bookNames(plan, design);

  const flagged = new Map<string, string[]>();
  for (const m of members) {
    const reasons = attentionReasons(m, problems, names);
    if (reasons.length > 0) flagged.set(m.id, reasons);
  }

  const sections: CalcSection[] = [];

  // Cover
  const failing = members.filter((m) => !m.passes).length;
  sections.push({
    id: 'cover',
    title: 'Calc book',
    blocks: [
      { type: 'heading', text: `${project.name} — ${scheme.name}` },
      {
        type: 'fields',
        rows: [
          ['Project', project.name],
          ...(project.number ? ([['Project number', project.number]] as [string, CalcCell][]) : []),
          ...(project.client ? ([['Client', project.client]] as [string, CalcCell][]) : []),
          ...(project.address ? ([['Address', project.address]] as [string, CalcCell][]) : []),
          ['Scheme', scheme.name],
          ['Plan revision', `${scheme.revision}${input.designedRevision !== undefined && input.designedRevision !== scheme.revision ? ` (design is of revision ${input.designedRevision})` : ''}`],
          ...(input.designedAt ? ([['Designed', input.designedAt.slice(0, 16).replace('T', ' ') + ' UTC']] as [string, CalcCell][]) : []),
          ['Date', input.date],
          ['Prepared by', input.preparedBy],
          ...(input.downloadedBy ? ([['Downloaded by', `${input.downloadedBy.name}, ${input.downloadedBy.at.slice(0, 16).replace('T', ' ')} UTC`]] as [string, CalcCell][]) : []),
          ['Design method', basis.method === 'LRFD' ? 'LRFD (load and resistance factor design)' : 'ASD (allowable strength design)'],
          ['Levels', levels.map((l) => l.name).join(', ') || '—'],
          ['Members', `${members.length} (${new Set(members.map((m) => m.mark)).size} marks), ${failing} failing`],
          ['Members printed', membersOption === 'all' ? 'every member' : 'one per mark (the one that works hardest), plus every member that needs attention'],
        ],
      },
      // Once on the cover (and in every page footer); the engine's own notice says the same, so it is not repeated.
      { type: 'caution', text: CALC_BOOK_CAUTION },
    ],
  });

  // Needs attention
  const planWide = problems.filter((p) => !p.elementId || !members.some((m) => m.id === p.elementId)).filter((p) => levelId === undefined || !p.elementId);
  const attentionRows: CalcCell[][] = members
    .filter((m) => flagged.has(m.id))
    .sort((a, b) => compareMarks(a.mark, b.mark) || a.id.localeCompare(b.id))
    .map((m) => [m.mark, names.where(m.id), m.shape ?? '—', opt(m.ratio, 3), m.governing ? (CHECK_TITLE[m.governing] ?? m.governing) : '—', flagged.get(m.id)!.join('; ')]);
  sections.push({
    id: 'attention',
    title: 'Needs attention',
    blocks:
      attentionRows.length === 0 && planWide.length === 0
        ? [{ type: 'paragraph', text: 'Every member printed here passes every check, and the plan has no problems.' }]
        : [
            ...(attentionRows.length > 0
              ? [
                  {
                    type: 'table',
                    columns: [
                      { label: 'Mark', weight: 0.7 },
                      { label: 'Grid location', weight: 0.8 },
                      { label: 'Shape', weight: 1 },
                      { label: 'Ratio', weight: 0.7, align: 'right' },
                      { label: 'Governing', weight: 1.2 },
                      { label: 'Why', weight: 4.5 },
                    ],
                    rows: attentionRows,
                  } as CalcBlock,
                ]
              : []),
            ...(planWide.length > 0 ? [{ type: 'list', items: planWide.map((p) => `${p.severity}: ${describeProblem(p.message, names)}`) } as CalcBlock] : []),
          ],
  });

  // Basis of design
  sections.push({
    id: 'basis',
    title: 'Basis of design',
    pageBreakBefore: true,
    blocks: [
      { type: 'heading', text: 'Code editions' },
      {
        type: 'table',
        columns: [
          { label: 'Standard', weight: 1.6 },
          { label: 'Used for', weight: 4 },
        ],
        rows: CODE_EDITIONS.map((c) => [c.code, c.scope]),
      },
      { type: 'paragraph', tone: 'soft', text: `Engine standards: ${STANDARDS.join(', ')}.` },
      { type: 'heading', text: 'Project settings' },
      {
        type: 'fields',
        rows: [
          ['Method', basis.method === 'LRFD' ? 'LRFD, ASCE 7-16 §2.3.1 combinations' : 'ASD, ASCE 7-16 §2.4.1 combinations'],
          ['Steel Fy, ksi', num(basis.Fy_ksi, 0)],
          ['E, ksi', num(E_KSI, 0)],
          ['Live-load deflection limit', deflLimit(basis.deflectionLimits.live)],
          ['Total-load deflection limit', deflLimit(basis.deflectionLimits.total)],
          [
            'Total deflection setting',
            `${basis.totalDeflectionIncludes === 'superimposedDeadAndLive' ? 'superimposed dead + live' : 'dead + live'}; computed with all loads (see assumptions)`,
          ],
          ['Live load reduction (ASCE 7-16 §4.7)', basis.liveLoadReduction ? 'on' : 'off (no reduction taken)'],
        ],
      },
      { type: 'heading', text: 'Assumptions and conservative readings' },
      { type: 'list', items: [...ENGINE_ASSUMPTIONS] },
    ],
  });

  // Load zones
  const usedZones = new Set(plan.decks.filter((dk) => levelId === undefined || dk.level === levelId).map((dk) => dk.zone));
  sections.push({
    id: 'zones',
    title: 'Load zones',
    blocks: [
      {
        type: 'table',
        caption: 'Area loads, psf',
        columns: [
          { label: 'Zone', weight: 2.2 },
          { label: 'Dead', weight: 0.8, align: 'right' },
          { label: 'Superimposed', weight: 1.2, align: 'right' },
          { label: 'Partitions', weight: 1, align: 'right' },
          { label: 'Live', weight: 0.8, align: 'right' },
          { label: 'Reducible', weight: 0.9 },
          { label: 'Roof live', weight: 0.9, align: 'right' },
          { label: 'Snow', weight: 0.8, align: 'right' },
        ],
        rows: plan.zones
          .filter((z) => levelId === undefined || usedZones.has(z.id))
          .map((z) => [z.name || z.id, num(z.dead_psf, 1), num(z.superimposedDead_psf, 1), num(z.partition_psf, 1), num(z.live_psf, 1), z.liveReducible ? 'yes' : 'no', num(z.roofLive_psf, 1), num(z.snow_psf, 1)]),
      },
      ...(plan.pointLoads.length + plan.lineLoads.length > 0
        ? [{ type: 'paragraph', tone: 'soft', text: `Placed loads: ${plan.pointLoads.length} point load(s) and ${plan.lineLoads.length} line load(s); each appears in the loads of the member that carries it, with its source.` } as CalcBlock]
        : []),
    ],
  });

  // Members by level
  const printed: SchemeMember[] = [];
  const othersOf = new Map<string, string[]>();
  const byMarkGroup = new Map<string, SchemeMember[]>();
  for (const m of members) {
    const key = `${m.level}|${m.mark}`;
    const g = byMarkGroup.get(key);
    if (g) g.push(m);
    else byMarkGroup.set(key, [m]);
  }
  for (const g of byMarkGroup.values()) {
    const ranked = [...g].sort(workHarder);
    const chosen = membersOption === 'all' ? ranked : ranked.filter((m, i) => i === 0 || flagged.has(m.id));
    for (const m of chosen) {
      printed.push(m);
      if (membersOption === 'distinct') othersOf.set(m.id, g.filter((x) => !chosen.includes(x)).map((x) => x.id));
    }
  }
  for (const level of levels) {
    const ofLevel = printed.filter((m) => m.level === level.id).sort((a, b) => compareMarks(a.mark, b.mark) || a.id.localeCompare(b.id));
    const all = members.filter((m) => m.level === level.id);
    sections.push({
      id: `level-${level.id}`,
      title: `${level.name} — members`,
      pageBreakBefore: true,
      blocks: [
        {
          type: 'table',
          caption: `${all.length} member(s), ${new Set(all.map((m) => m.mark)).size} mark(s); elevation ${level.elevation_ft} ft${level.roof ? ', roof' : ''}`,
          columns: [
            { label: 'Mark', weight: 0.8 },
            { label: 'Grid locations', weight: 2.2 },
            { label: 'Shape', weight: 1.1 },
            { label: 'Span, ft', weight: 0.9, align: 'right' },
            { label: 'Ratio', weight: 0.8, align: 'right' },
            { label: 'Governing', weight: 1.5 },
          ],
          rows: [...new Set(all.map((m) => m.mark))].sort(compareMarks).map((mark) => {
            const g = all.filter((m) => m.mark === mark).sort(workHarder);
            return [mark, g.map((m) => names.where(m.id)).join('; '), g[0].shape ?? '—', num(g[0].span_ft, 2), opt(g[0].ratio, 3), g[0].governing ? (CHECK_TITLE[g[0].governing] ?? g[0].governing) : '—'];
          }),
        },
      ],
    });
    for (const m of ofLevel) sections.push(memberSection(m, othersOf.get(m.id) ?? [], level.name, flagged.get(m.id) ?? [], names, limitRefs(plan, m.id)));
  }

  // Column stack and column pages (AISC 360-16 Chapter E)
  const columns = (design.columns ?? []).filter((c) => levelId === undefined || c.levels.some((l) => l.level === levelId));
  const lrfdCol = design.method === 'LRFD';
  sections.push({
    id: 'columns',
    title: 'Column stack',
    pageBreakBefore: true,
    blocks:
      columns.length === 0
        ? [{ type: 'paragraph', text: 'No columns carry framing on the levels printed.' }]
        : [
            {
              type: 'paragraph',
              tone: 'soft',
              text: 'Cumulative from the top down, unfactored kip; live reduced on the cumulative AT with KLL = 4 (ASCE 7-16 §4.7.2, Eq. 4.7-1). Each row is the column length below that level (Lc = storey height, K = 1.0, pinned gravity column). Pr is the governing combination and includes the column self weight down to the bottom of the length (conservative). Tiers: two storeys by default (common practice); the splice is taken at the floor, so the storey above a splice is checked with the upper shape over its whole height (conservative).',
            },
            {
              type: 'table',
              columns: [
                { label: 'Column', weight: 0.9 },
                { label: 'Level', weight: 1.1 },
                { label: 'D', weight: 0.8, align: 'right' },
                { label: 'L red.', weight: 0.8, align: 'right' },
                { label: 'Lr', weight: 0.6, align: 'right' },
                { label: 'S', weight: 0.6, align: 'right' },
                { label: 'Factor', weight: 0.7, align: 'right' },
                { label: 'Tier', weight: 0.5, align: 'right' },
                { label: 'Shape', weight: 1.1 },
                { label: 'Lc, ft', weight: 0.7, align: 'right' },
                { label: 'Pr', weight: 0.8, align: 'right' },
                { label: lrfdCol ? 'φcPn' : 'Pn/Ωc', weight: 0.8, align: 'right' },
                { label: 'Ratio', weight: 0.7, align: 'right' },
                { label: 'Governing', weight: 1.3 },
              ],
              rows: columns.flatMap((c) =>
                c.levels.map((l) => [
                  names.column(c.id),
                  `${levelName.get(l.level) ?? l.level}${l.spliceBelow ? ' (splice below)' : ''}`,
                  num(l.D_kip, 1),
                  num(l.L_kip, 1),
                  num(l.Lr_kip, 1),
                  num(l.S_kip, 1),
                  num(l.liveReductionFactor, 3),
                  l.tier === null || l.tier === undefined ? '—' : String(l.tier),
                  l.shape ?? '—',
                  num(l.Lc_ft ?? 0, 2),
                  num(l.Pr_kip, 1),
                  l.Pc_kip == null ? '—' : num(l.Pc_kip, 1),
                  l.ratio == null ? '—' : num(l.ratio, 3),
                  l.governing ?? l.combination,
                ]),
              ),
            },
          ],
  });
  for (const c of columns) {
    if (!c.tiers || c.tiers.length === 0) continue;
    sections.push({
      id: `column-${c.id}`,
      title: names.column(c.id).replace(/^c/, 'C'),
      blocks: [
        {
          type: 'paragraph',
          text: `${c.tiers.length} tier(s)${c.spliceLevels?.length ? `, splices above ${c.spliceLevels.map((l) => levelName.get(l) ?? l).join(', ')}` : ''}${c.locked ? `; size locked to ${c.locked} (checked, not replaced)` : ''}; ${cellText(num(c.weight_lb, 0))} lb of steel. Flexural buckling about both axes, AISC 360-16 E3 (Fe by Eq. E3-4; Fcr by Eq. E3-2 where Lc/r ≤ 4.71 sqrt(E/Fy), else Eq. E3-3; Pn = Fcr Ag, Eq. E3-1) or E7 where Table B4.1a makes the web or flanges slender (Pn = Fcr Ae, Eq. E7-1, effective widths by Eq. E7-2/E7-3); ${lrfdCol ? 'φc = 0.90' : 'Ωc = 1.67'} (E1). E = ${cellText(num(E_KSI, 0))} ksi.`,
        },
        {
          type: 'table',
          columns: [
            { label: 'Level', weight: 1.1 },
            { label: 'Shape', weight: 1 },
            { label: 'Lc/r', weight: 0.7, align: 'right' },
            { label: 'Fcr, ksi', weight: 0.8, align: 'right' },
            { label: 'Pn', weight: 0.8, align: 'right' },
            { label: lrfdCol ? 'φcPn' : 'Pn/Ωc', weight: 0.8, align: 'right' },
            { label: 'Pr', weight: 0.8, align: 'right' },
            { label: 'Own wt', weight: 0.7, align: 'right' },
            { label: 'Ratio', weight: 0.7, align: 'right' },
            { label: 'Limit state', weight: 2.4 },
          ],
          rows: c.levels.filter((l) => l.shape).map((l) => [
            levelName.get(l.level) ?? l.level,
            l.shape ?? '—',
            l.slenderness == null ? '—' : num(l.slenderness, 1),
            l.Fcr_ksi == null ? '—' : num(l.Fcr_ksi, 2),
            l.Pn_kip == null ? '—' : num(l.Pn_kip, 1),
            l.Pc_kip == null ? '—' : num(l.Pc_kip, 1),
            num(l.Pr_kip, 1),
            num(l.selfWeight_kip ?? 0, 2),
            l.ratio == null ? '—' : num(l.ratio, 3),
            `${l.limitState ?? ''} (${l.clause ?? ''}, ${l.equation ?? ''}; ${l.governing})`,
          ]),
        },
        ...c.tiers.filter((t) => !t.passes).map((t) => ({ type: 'paragraph' as const, text: `Tier ${t.tier} does not pass: ${t.failure ?? 'ratio above 1.0'}.` })),
      ],
    });
  }

  // Equilibrium
  const eq = design.equilibrium;
  sections.push({
    id: 'equilibrium',
    title: 'Equilibrium',
    blocks: [
      {
        type: 'paragraph',
        tone: 'soft',
        text: 'Whole scheme, every level, per load case: load applied (area × pressure + line + point + self weight) against the sum of column and wall reactions, unfactored kip.',
      },
      {
        type: 'table',
        columns: [
          { label: 'Load case', weight: 1.2 },
          { label: 'Applied', weight: 1, align: 'right' },
          { label: 'Reactions', weight: 1, align: 'right' },
          { label: 'Difference', weight: 1, align: 'right' },
        ],
        rows: (['D', 'L', 'Lr', 'S'] as const)
          .filter((k) => eq?.[k])
          .map((k) => [k, num(eq[k].applied_kip, 2), num(eq[k].reactions_kip, 2), num(eq[k].reactions_kip - eq[k].applied_kip, 3)]),
      },
    ],
  });

  return {
    title: `Calc book — ${project.name}, ${scheme.name}`,
    caution: CALC_BOOK_CAUTION,
    marks: [...new Set(members.map((m) => m.mark))].sort(compareMarks),
    sections,
    runningTitle: `Baywright calc book · ${project.name} · ${scheme.name} · rev ${scheme.revision} · ${input.date}`,
  };
}

/** A one-member calc sheet: the calc book's member working with a title block, for one member. */
export interface MemberCalcSheetInput extends Omit<CalcBookInput, 'options'> {
  memberId: string;
}

const sourceText = (s: 'member' | 'basis') => (s === 'member' ? 'set on this member' : 'from the design basis');

/**
 * The calc sheet of one member (the Member sheet's download): title block, caution, the
 * member's loads, Mu / Vu (Ma / Va in ASD), unbraced segments, every check with its clause
 * and working, deflection against the limits used (with where each came from), composite
 * stages where composite, reactions. Null when the design has no such member.
 */
export function buildMemberCalcSheet(input: MemberCalcSheetInput): CalcBook | null {
  const { plan, design, project, scheme } = input;
  const m = (design.members ?? []).find((x) => x.id === input.memberId);
  if (!m) return null;
  const pm = plan.members.find((x) => x.id === m.id);
  const basis = plan.designBasis;
  const level = plan.levels.find((l) => l.id === m.level);
  const limits = memberDeflectionLimits(basis, { deflectionLimits: pm?.deflectionLimits ?? null });
  const bracingSource = memberBracingSource({ bracing: pm?.bracing ?? null, Lb_override_ft: pm?.Lb_override_ft ?? null });
  const names = bookNames(plan, design);
  const reasons = attentionReasons(m, design.problems ?? [], names);
  const section = memberSection(m, [], level?.name ?? m.level, reasons, names, limitRefs(plan, m.id));
  const d = m.design;
  const lrfd = (d?.method ?? basis.method) === 'LRFD';
  const settingsRows: [string, CalcCell][] = [
    [lrfd ? 'Mu (required flexural strength), kip-ft' : 'Ma (required flexural strength), kip-ft', d ? num(d.Mr_kipft, 1) : null],
    [lrfd ? 'φbMn (available), kip-ft' : 'Mn/Ωb (available), kip-ft', d ? num(d.Mc_kipft, 1) : null],
    [lrfd ? 'Vu (required shear strength), kip' : 'Va (required shear strength), kip', d ? num(d.Vr_kip, 1) : null],
    [lrfd ? 'φvVn (available), kip' : 'Vn/Ωv (available), kip', d ? num(d.Vc_kip, 1) : null],
    ['Lb of the governing segment, ft', d ? num(d.Lb_ft, 2) : null],
    ['Bracing', `${describeBracing(m, bracingSource.bracing === 'member')}; ${sourceText(bracingSource.bracing)}`],
    ['Lb override', bracingSource.Lb_override_ft === null ? 'none (Lb between brace points)' : `${bracingSource.Lb_override_ft.toFixed(2)} ft on every segment, Cb = 1.0; set on this member`],
    ['Live-load deflection limit', `${deflLimit(limits.live)}; ${sourceText(limits.source.live)}`],
    ['Total-load deflection limit', `${deflLimit(limits.total)}; ${sourceText(limits.source.total)}`],
    ['Live-load deflection, in', d ? num(d.deflectionLive_in, 3) : null],
    ['Total-load deflection, in', d ? num(d.deflectionTotal_in, 3) : null],
  ];
  // Strength and serviceability summary first, after the member's own fields.
  const blocks = [...section.blocks];
  const at = blocks.findIndex((b) => b.type === 'fields');
  blocks.splice(at + 1, 0, { type: 'table', caption: 'Summary: demand, capacity and the limits used', columns: [{ label: 'Quantity', weight: 3 }, { label: 'Value', weight: 3.2 }], rows: settingsRows });
  if (d?.composite) {
    const c = d.composite;
    blocks.push({
      type: 'table',
      caption: 'Composite stages (AISC 360-16 Chapter I)',
      columns: [
        { label: 'Stage', weight: 1.6 },
        { label: 'Mr, kip-ft', weight: 1, align: 'right' },
        { label: 'Mc, kip-ft', weight: 1, align: 'right' },
        { label: 'Ratio', weight: 0.8, align: 'right' },
        { label: 'Deflection, in', weight: 1, align: 'right' },
        { label: 'Basis', weight: 3 },
      ],
      rows: [
        ['Construction (bare steel, wet concrete)', num(c.construction.Mr_kipft, 1), num(c.construction.Mc_kipft, 1), num(c.construction.ratio, 3), num(c.construction.deflection_in, 3), `${c.construction.combination}, ${c.construction.clause}; Lb ${c.construction.Lb_ft.toFixed(2)} ft`],
        ['Composite (concrete hardened)', num(d.Mr_kipft, 1), num(c.Mc_kipft, 1), num(d.ratios.flexure, 3), num(c.deflectionLive_in, 3), `${c.studs} studs, ${Math.round(c.percentComposite * 100)} % composite, I_LB ${c.Ilb_in4.toFixed(0)} in⁴ (Commentary Eq. C-I3-1); live-load deflection`],
      ],
    });
  }
  const title = `${m.mark} — ${m.shape ?? 'no shape'}`;
  return {
    title: `Member calc sheet — ${project.name}, ${scheme.name}, ${m.mark}`,
    caution: CALC_BOOK_CAUTION,
    marks: [m.mark],
    sections: [
      {
        id: 'cover',
        title: 'Member calc sheet',
        blocks: [
          { type: 'heading', text: `${project.name} — ${scheme.name} — ${m.mark}` },
          {
            type: 'fields',
            rows: [
              ['Project', project.name],
              ...(project.number ? ([['Project number', project.number]] as [string, CalcCell][]) : []),
              ...(project.client ? ([['Client', project.client]] as [string, CalcCell][]) : []),
              ...(project.address ? ([['Address', project.address]] as [string, CalcCell][]) : []),
              ['Scheme', scheme.name],
              ['Plan revision', `${scheme.revision}${input.designedRevision !== undefined && input.designedRevision !== scheme.revision ? ` (design is of revision ${input.designedRevision})` : ''}`],
              ...(input.designedAt ? ([['Designed', input.designedAt.slice(0, 16).replace('T', ' ') + ' UTC']] as [string, CalcCell][]) : []),
              ['Date', input.date],
              ['Prepared by', input.preparedBy],
              ...(input.downloadedBy ? ([['Downloaded by', `${input.downloadedBy.name}, ${input.downloadedBy.at.slice(0, 16).replace('T', ' ')} UTC`]] as [string, CalcCell][]) : []),
              ['Member', `${m.mark} (${m.kind}), ${level?.name ?? m.level}`],
              ['Design method', basis.method === 'LRFD' ? 'LRFD, ASCE 7-16 §2.3.1 combinations' : 'ASD, ASCE 7-16 §2.4.1 combinations'],
              ['Steel Fy, ksi; E, ksi', `${basis.Fy_ksi}; ${E_KSI}`],
              ['Standards', 'AISC 360-16 (Chapters F, G; I where composite), ASCE 7-16 §2.3/§2.4 and §4.7, IBC Table 1604.3, AISC Shapes Database v15.0'],
            ],
          },
          { type: 'caution', text: CALC_BOOK_CAUTION },
        ],
      },
      { ...section, title, blocks },
    ],
    runningTitle: `Baywright member calc sheet · ${project.name} · ${scheme.name} · ${m.mark} · rev ${scheme.revision} · ${input.date}`,
  };
}
