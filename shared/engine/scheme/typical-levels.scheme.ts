/**
 * Typical levels: floors whose framing, decks, openings and loads are the same (coordinates,
 * sizes, settings; element ids aside) are taken down and designed once, as a one-level plan
 * (the level's template), and the result is placed on each of those levels under its own ids.
 *
 * Floor framing on one level never bears on another level's framing (design-basis §2: members
 * deliver to members of their level or to columns), so a level's takedown and its members'
 * designs depend only on that level's elements, the columns present at it, the zones and the
 * design basis. The whole-plan sums (equilibrium, column receipts, floor area) are made again
 * in the whole plan's order from the template's parts (TakedownTrace), so every figure is the
 * same number, to the last bit, as a takedown of the whole plan at once.
 *
 * Ids: in a template every level-local id (members, decks, openings, point and line loads,
 * and the level) is a placeholder `\uE000nnnnnnn\uE001`, numbered by the rank of the real id
 * among that level's ids, so placeholders compare as the real ids do (the takedown breaks ties
 * by id). Two levels share a template only when their placeholder plans are equal, ranks
 * included. Text the template wrote (load sources, notes) gets the real ids back by
 * substitution; a plan whose text already holds the placeholder characters is not templated.
 */
import type { Plan, PlanLevel } from '../../schemas/plan.schema';

const OPEN = '\uE000';
const CLOSE = '\uE001';
const LEVEL_PLACEHOLDER = `${OPEN}L${CLOSE}`;
/** A placeholder (RANK_DIGITS digits). */
const PLACEHOLDER = /\uE000(L|\d{7})\uE001/g;

/** One level placed from a template: its id and the real id of each placeholder rank. */
export interface TemplateLevel {
  levelId: string;
  ids: string[];
}

export interface LevelTemplate {
  /** The one-level plan with placeholder ids. */
  plan: Plan;
  /** Equal for equal templates (the placeholder plan's text). */
  signature: string;
  levels: TemplateLevel[];
}

const RANK_DIGITS = 7;
const placeholder = (rank: number) => `${OPEN}${String(rank).padStart(RANK_DIGITS, '0')}${CLOSE}`;

/** The real text of a string the template wrote, for one level. */
export function realText(s: string, level: TemplateLevel): string {
  // A whole placeholder (an element id): the real id itself, no new text.
  if (s.length === RANK_DIGITS + 2 && s.charCodeAt(0) === 0xe000 && s.charCodeAt(RANK_DIGITS + 1) === 0xe001) {
    let rank = 0;
    for (let i = 1; i <= RANK_DIGITS; i++) rank = rank * 10 + (s.charCodeAt(i) - 48);
    return level.ids[rank];
  }
  if (s === LEVEL_PLACEHOLDER) return level.levelId;
  let at = s.indexOf(OPEN);
  if (at === -1) return s;
  let out = '';
  let from = 0;
  while (at !== -1) {
    out += s.slice(from, at);
    if (s.charCodeAt(at + 1) === 76 /* L */ && s.charCodeAt(at + 2) === 0xe001) {
      out += level.levelId;
      from = at + 3;
    } else {
      let rank = 0;
      for (let i = 1; i <= RANK_DIGITS; i++) rank = rank * 10 + (s.charCodeAt(at + i) - 48);
      out += level.ids[rank];
      from = at + RANK_DIGITS + 2;
    }
    at = s.indexOf(OPEN, from);
  }
  return out + s.slice(from);
}

/**
 * Real copies for one level: plain data with every string's placeholders replaced; parts with
 * nothing to replace are returned as they are (shared), keys keep their order, and an object
 * met twice (template results share load objects between lists) is copied once.
 */
export class LevelRenamer {
  private readonly seen = new Map<object, unknown>();

  constructor(readonly level: TemplateLevel) {}

  text(s: string): string {
    return realText(s, this.level);
  }

  /** A list of loads with real sources (a load's only text); loads whose source names no element are shared. */
  loads<T extends { source?: string }>(list: readonly T[]): T[] {
    const out: T[] = new Array(list.length);
    for (let i = 0; i < list.length; i++) {
      const l = list[i];
      const source = l.source === undefined ? undefined : realText(l.source, this.level);
      out[i] = source === l.source ? l : { ...l, source };
    }
    return out;
  }

  data<T>(value: T): T {
    if (typeof value === 'string') return realText(value, this.level) as T;
    if (typeof value !== 'object' || value === null) return value;
    const hit = this.seen.get(value);
    if (hit !== undefined) return hit as T;
    let result: unknown = value;
    if (Array.isArray(value)) {
      let out: unknown[] | null = null;
      for (let i = 0; i < value.length; i++) {
        const v = value[i];
        const r = this.data(v);
        if (r !== v && out === null) out = value.slice(0, i);
        if (out !== null) out.push(r);
      }
      if (out) result = out;
    } else if (Object.getPrototypeOf(value) === Object.prototype) {
      // (Typed arrays and maps never hold ids here.)
      let out: Record<string, unknown> | null = null;
      const src = value as Record<string, unknown>;
      for (const k in src) {
        const v = src[k];
        const r = this.data(v);
        if (r !== v && out === null) {
          out = {};
          for (const k2 in src) {
            if (k2 === k) break;
            out[k2] = src[k2];
          }
        }
        if (out !== null) out[k] = r;
      }
      if (out) result = out;
    }
    this.seen.set(value, result);
    return result as T;
  }
}

type Local = { id?: string; level: string };

/**
 * The templates of a plan's levels, or null where templating gains nothing (no two levels
 * alike) or cannot be done safely (an element without an id or on an unknown level, repeated
 * level ids, placeholder characters in the plan's text).
 */
export function typicalLevelTemplates(plan: Plan): LevelTemplate[] | null {
  if (plan.levels.length < 2) return null;
  const levelIds = new Set<string>();
  for (const l of plan.levels) {
    if (levelIds.has(l.id)) return null;
    levelIds.add(l.id);
  }
  const byLevel = new Map<string, { members: Plan['members']; decks: Plan['decks']; pointLoads: Plan['pointLoads']; lineLoads: Plan['lineLoads']; openings: Plan['openings'] }>();
  for (const l of plan.levels) byLevel.set(l.id, { members: [], decks: [], pointLoads: [], lineLoads: [], openings: [] });
  const sort = <K extends 'members' | 'decks' | 'pointLoads' | 'lineLoads' | 'openings'>(key: K): boolean => {
    for (const e of plan[key] as Local[]) {
      const g = byLevel.get(e.level);
      if (!g || typeof e.id !== 'string') return false;
      (g[key] as Local[]).push(e);
    }
    return true;
  };
  if (!sort('members') || !sort('decks') || !sort('pointLoads') || !sort('lineLoads') || !sort('openings')) return null;

  const groups = new Map<string, LevelTemplate>();
  for (const level of plan.levels) {
    const g = byLevel.get(level.id)!;
    const local: Local[] = [...g.members, ...g.decks, ...g.pointLoads, ...g.lineLoads, ...g.openings];
    const ids = local.map((e) => e.id!);
    const ranked = [...ids].sort();
    for (let i = 1; i < ranked.length; i++) if (ranked[i] === ranked[i - 1]) return null;
    const rank = new Map(ranked.map((id, i) => [id, i]));
    const swap = <T extends Local>(e: T): T => ({ ...e, id: placeholder(rank.get(e.id!)!), level: LEVEL_PLACEHOLDER });
    const { id: _id, name: _name, elevation_ft: _elevation, ...levelRest } = level;
    const templateLevel: PlanLevel = { ...levelRest, id: LEVEL_PLACEHOLDER, name: LEVEL_PLACEHOLDER, elevation_ft: 0 };
    const template: Plan = {
      ...plan,
      levels: [templateLevel],
      // Every column stays (a member end on a column that skips this level is that problem);
      // those at this level list only the template's level.
      columns: plan.columns.map((c) => ({ id: c.id, x_ft: c.x_ft, y_ft: c.y_ft, levels: c.levels.includes(level.id) ? [LEVEL_PLACEHOLDER] : [] })),
      members: g.members.map(swap),
      decks: g.decks.map(swap),
      pointLoads: g.pointLoads.map(swap),
      lineLoads: g.lineLoads.map(swap),
      openings: g.openings.map(swap),
    };
    const signature = JSON.stringify([templateLevel, template.columns, template.members, template.decks, template.pointLoads, template.lineLoads, template.openings]);
    const placed: TemplateLevel = { levelId: level.id, ids: ranked };
    const group = groups.get(signature);
    if (group) group.levels.push(placed);
    else groups.set(signature, { plan: template, signature, levels: [placed] });
  }
  if (groups.size === plan.levels.length) return null;
  // Placeholder characters anywhere in the plan's text would be taken for ids (the signatures
  // hold every level-local element and every column id; the rest is checked here).
  for (const signature of groups.keys()) if (signature.replace(PLACEHOLDER, '').includes(OPEN)) return null;
  if (JSON.stringify([plan.name, plan.designBasis, plan.zones, plan.levels, plan.grids ?? null, plan.columns]).includes(OPEN)) return null;
  return [...groups.values()];
}
