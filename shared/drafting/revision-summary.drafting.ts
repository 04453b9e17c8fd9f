/**
 * A short summary of what one plan revision changed against the one before, in the words a
 * person reads on the revisions list: "2 beams added, 1 size locked (2B1), deck changed",
 * counts by element kind and grid-line labels, never internal ids. Pure: it compares two
 * stored plan files (the JSON the revision table keeps) element by element on their ids.
 */

type Json = Record<string, unknown>;
type Element = Json & { id?: unknown };

const list = (plan: Json | null, key: string): Element[] => (plan && Array.isArray(plan[key]) ? (plan[key] as Element[]) : []);
const byId = (items: Element[]) => new Map(items.filter((e) => typeof e.id === 'string').map((e) => [e.id as string, e]));
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

interface Diff<T> {
  added: T[];
  removed: T[];
  changed: { before: T; after: T }[];
}

function diff(before: Element[], after: Element[]): Diff<Element> {
  const a = byId(before);
  const b = byId(after);
  const out: Diff<Element> = { added: [], removed: [], changed: [] };
  for (const [id, e] of b) {
    const old = a.get(id);
    if (!old) out.added.push(e);
    else if (!same(old, e)) out.changed.push({ before: old, after: e });
  }
  for (const [id, e] of a) if (!b.has(id)) out.removed.push(e);
  return out;
}

/** "2B1, 2B2" for up to three marks, else nothing (the count says it). */
function marksOf(members: Element[]): string {
  const marks = [...new Set(members.map((m) => (typeof m.mark === 'string' && m.mark ? m.mark : null)).filter((m): m is string => m !== null))];
  return marks.length > 0 && marks.length <= 3 ? ` (${marks.join(', ')})` : '';
}

/** What changed from `before` (null for the first revision) to `after`. */
export function summarizeRevision(before: Json | null, after: Json): string {
  if (!before) {
    const members = list(after, 'members').length;
    const columns = list(after, 'columns').length;
    return `First revision: ${plural(members, 'member')}, ${plural(columns, 'column')}, ${plural(list(after, 'levels').length, 'level')}`;
  }
  const parts: string[] = [];

  const levels = diff(list(before, 'levels'), list(after, 'levels'));
  const levelName = (l: Element) => (typeof l.name === 'string' && l.name ? l.name : 'a level');
  for (const l of levels.added) parts.push(`${levelName(l)} added`);
  for (const l of levels.removed) parts.push(`${levelName(l)} removed`);
  if (levels.changed.length) parts.push(`${plural(levels.changed.length, 'level')} changed`);

  const grids = diff(list(before, 'grids'), list(after, 'grids'));
  const gridName = (g: Element) => `grid line ${typeof g.label === 'string' && g.label ? g.label : '?'}`;
  const gridWords = (items: Element[], verb: string) => {
    if (items.length === 0) return;
    parts.push(items.length <= 3 ? `${items.map(gridName).join(', ')} ${verb}` : `${items.length} grid lines ${verb}`);
  };
  gridWords(grids.added, 'added');
  gridWords(grids.removed, 'removed');
  gridWords(grids.changed.map((c) => c.after), 'moved or renamed');

  const members = diff(list(before, 'members'), list(after, 'members'));
  for (const kind of ['beam', 'girder'] as const) {
    const added = members.added.filter((m) => m.kind === kind);
    const removed = members.removed.filter((m) => m.kind === kind);
    if (added.length) parts.push(`${plural(added.length, kind)} added`);
    if (removed.length) parts.push(`${plural(removed.length, kind)} removed${marksOf(removed)}`);
  }
  const moved = members.changed.filter((c) => !same(c.before.start, c.after.start) || !same(c.before.end, c.after.end));
  const locked = members.changed.filter((c) => c.before.shape == null && typeof c.after.shape === 'string');
  const unlocked = members.changed.filter((c) => typeof c.before.shape === 'string' && c.after.shape == null);
  const resized = members.changed.filter((c) => typeof c.before.shape === 'string' && typeof c.after.shape === 'string' && c.before.shape !== c.after.shape);
  const remarked = members.changed.filter((c) => (c.before.mark ?? null) !== (c.after.mark ?? null));
  const otherwise = members.changed.filter((c) => !moved.includes(c) && !locked.includes(c) && !unlocked.includes(c) && !resized.includes(c) && !remarked.includes(c));
  if (moved.length) parts.push(`${plural(moved.length, 'member')} moved${marksOf(moved.map((c) => c.before))}`);
  if (locked.length) parts.push(`${plural(locked.length, 'size')} locked${marksOf(locked.map((c) => c.after))}`);
  if (unlocked.length) parts.push(`${plural(unlocked.length, 'size')} unlocked${marksOf(unlocked.map((c) => c.after))}`);
  if (resized.length) parts.push(`${plural(resized.length, 'locked size')} changed${marksOf(resized.map((c) => c.after))}`);
  if (remarked.length) parts.push(`${plural(remarked.length, 'mark')} changed${marksOf(remarked.map((c) => c.after))}`);
  if (otherwise.length) parts.push(`${plural(otherwise.length, 'member')} edited${marksOf(otherwise.map((c) => c.after))}`);

  const counted: [string, string, string][] = [
    ['columns', 'column', 'columns'],
    ['decks', 'deck', 'decks'],
    ['zones', 'load zone', 'load zones'],
    ['pointLoads', 'point load', 'point loads'],
    ['lineLoads', 'line load', 'line loads'],
    ['openings', 'opening', 'openings'],
  ];
  for (const [key, one, many] of counted) {
    const d = diff(list(before, key), list(after, key));
    if (d.added.length) parts.push(`${plural(d.added.length, one, many)} added`);
    if (d.removed.length) parts.push(`${plural(d.removed.length, one, many)} removed`);
    if (d.changed.length) parts.push(`${plural(d.changed.length, one, many)} changed`);
  }
  if (!same(before.designBasis, after.designBasis)) parts.push('design basis changed');
  if (parts.length === 0) return same(before, after) ? 'No change to the plan' : 'Plan details changed';
  const text = parts.join(', ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}
