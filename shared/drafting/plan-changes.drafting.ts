/**
 * The elements of a plan as people name them in sentences about a change or a merge: members
 * by kind, mark and grid location, columns and loads by grid position, levels, zones and grid
 * lines by name or label, deck areas and openings by their level — never by id. And what
 * changed between two versions of a plan, one short line per element ("beam 2B1 at B–C / 2:
 * size W21X44"), with no figures in units (the client shows those in the reader's units).
 * Pure.
 */
import type { Plan, PlanMember } from '../schemas/plan.schema';
import { comparableElement, sameElement } from '../schemas/plan-element-compare';
import { MERGED_KINDS, type MergeConflict } from '../schemas/plan-merge';
import { gridIntersectionLabel } from './grid-location.drafting';
import { planNamer } from './element-names.drafting';

type Kind = (typeof MERGED_KINDS)[number];
type El = { id: string } & Record<string, unknown>;

function byId(plan: Plan, kind: Kind, id: string): El | undefined {
  return ((plan[kind] ?? []) as El[]).find((e) => e.id === id);
}

function levelName(plans: readonly Plan[], id: unknown): string {
  for (const p of plans) {
    const l = p.levels.find((x) => x.id === id);
    if (l) return l.name;
  }
  return 'a level';
}

/**
 * The name of an element of `kind` with `id`, looked up in the first plan that has it
 * ("beam 2B1 at B–C / 2", "column at B / 2", "point load at C / 3 on Level 2", "Level 3",
 * "load zone Open office", "grid line C", "deck area on Level 2", "the design basis").
 */
export function elementName(kind: MergeConflict['kind'], id: string, plans: readonly Plan[]): string {
  if (kind === 'settings') return 'the design basis';
  const plan = plans.find((p) => byId(p, kind, id));
  const el = plan ? byId(plan, kind, id) : undefined;
  if (!plan || !el) return `a ${KIND_WORD[kind]}`;
  const on = 'level' in el ? ` on ${levelName(plans, el.level)}` : '';
  switch (kind) {
    case 'members':
      return planNamer(plan).member(id) ?? 'a member';
    case 'levels':
      return String(el.name);
    case 'zones':
      return `load zone ${String(el.name)}`;
    case 'grids':
      return `grid line ${String(el.label)}`;
    case 'columns': {
      const at = gridIntersectionLabel(Number(el.x_ft), Number(el.y_ft), plan.grids);
      return at ? `column at ${at}` : `column at (${Number(el.x_ft).toFixed(1)}, ${Number(el.y_ft).toFixed(1)}) ft`;
    }
    case 'pointLoads':
    case 'lineLoads': {
      const where = planNamer(plan).load(id);
      return `${KIND_WORD[kind]}${where ? ` ${where}` : ''}${on}`;
    }
    default:
      return `${KIND_WORD[kind]}${on}`;
  }
}

const KIND_WORD: Record<Kind, string> = {
  levels: 'level',
  grids: 'grid line',
  columns: 'column',
  members: 'member',
  decks: 'deck area',
  zones: 'load zone',
  pointLoads: 'point load',
  lineLoads: 'line load',
  openings: 'opening',
};

/** What one version of an element says differently from another, without figures: "size W21X44", "moved". */
export function changeWords(kind: Kind, before: El, after: El): string {
  const a = comparableElement(kind, before) as El;
  const b = comparableElement(kind, after) as El;
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].filter((k) => JSON.stringify(a[k]) !== JSON.stringify(b[k]));
  const words: string[] = [];
  for (const k of keys) {
    if (kind === 'members' && k === 'shape') words.push((after as PlanMember).shape ? `size ${(after as PlanMember).shape}` : 'size left to the design');
    else if (kind === 'columns' && k === 'shape') words.push(after.shape ? `size ${String(after.shape)}` : 'size left to the design');
    else if (k === 'start' || k === 'end' || k === 'x_ft' || k === 'y_ft' || k === 'polygon' || k === 'offset_ft' || k === 'elevation_ft') words.push('moved');
    else if (k === 'kind') words.push(`now a ${String(after.kind)}`);
    else if (k === 'name' || k === 'label') words.push(`renamed ${String(after[k])}`);
    else if (k === 'level') words.push('moved to another level');
    else if (/_kip$|_klf$|_psf$/.test(k)) words.push('loads changed');
    else if (k === 'mark' || k === 'markLocked') words.push(after.mark ? `mark ${String(after.mark)}` : 'mark released');
    else words.push('settings changed');
  }
  return [...new Set(words)].join(', ') || 'changed';
}

/** One line per element that differs going from `from` to `to`: "beam 2B1 at B–C / 2: size W21X44", "column at B / 2 added". */
export function describeChanges(from: Plan, to: Plan): string[] {
  const lines: string[] = [];
  for (const kind of MERGED_KINDS) {
    const a = new Map(((from[kind] ?? []) as El[]).map((e) => [e.id, e]));
    const b = new Map(((to[kind] ?? []) as El[]).map((e) => [e.id, e]));
    for (const [id, e] of b) {
      const before = a.get(id);
      if (!before) lines.push(`${elementName(kind, id, [to])} added`);
      else if (!sameElement(kind, before, e)) lines.push(`${elementName(kind, id, [to, from])}: ${changeWords(kind, before, e)}`);
    }
    for (const id of a.keys()) if (!b.has(id)) lines.push(`${elementName(kind, id, [from])} removed`);
  }
  if (JSON.stringify(from.designBasis) !== JSON.stringify(to.designBasis)) lines.push('the design basis changed');
  return lines;
}

/** What one side did to a conflicting element, relative to the base: "removed", "added", "size W24X55". */
export function sideWords(conflict: MergeConflict, base: Plan, side: Plan): string {
  if (conflict.kind === 'settings') return 'design basis changed';
  const b = byId(base, conflict.kind, conflict.id);
  const s = byId(side, conflict.kind, conflict.id);
  if (!s) return 'removed';
  if (!b) return 'added';
  return changeWords(conflict.kind, b, s);
}
