// The Member sheet's bracing and deflection-limit controls as plain data: what the form shows
// for a member's plan settings, and the plan settings a filled-in form stands for (or the
// field-named errors that keep it from being applied). Pure.
import type { PlanBracing, PlanMemberDeflectionLimits } from '../../../../shared/schemas/plan.schema';
import { formatValue, parseQuantity, type UnitSystem } from '../../../lib/units';

/** What the plan stores for a member's bracing, Lb override and deflection limits. */
export interface MemberBracingSettings {
  bracing: PlanBracing | null;
  Lb_override_ft: number | null;
  deflectionLimits: PlanMemberDeflectionLimits | null;
}

export type BracingMode = 'auto' | 'continuous' | 'none' | 'thirds' | 'points';

export const BRACING_MODE_LABELS: Record<BracingMode, string> = {
  auto: 'From the framing and deck (design basis)',
  continuous: 'Continuously braced (deck attached)',
  none: 'At the supports only',
  thirds: 'At third points',
  points: 'At brace points I give',
};

export interface MemberSettingsForm {
  mode: BracingMode;
  /** Brace positions from the start support, in the units shown, comma separated. */
  points: string;
  /** Lb override in the units shown; blank = none. */
  lbOverride: string;
  /** Denominators n of span/n; blank = the design basis. */
  liveLimit: string;
  totalLimit: string;
}

export type MemberSettingsErrors = Partial<Record<keyof MemberSettingsForm, string>>;

/** 1e-6 ft: positions that agree this closely are the same point. */
const SAME_FT = 1e-6;
/** The largest span/n denominator a plan file accepts (shared/schemas/plan-limits.ts). */
const MAX_DENOMINATOR = 100_000;

export function thirdPoints(spanFt: number): number[] {
  return [spanFt / 3, (2 * spanFt) / 3];
}

function isThirds(points: readonly number[], spanFt: number): boolean {
  const t = thirdPoints(spanFt);
  return points.length === 2 && Math.abs(points[0] - t[0]) < 1e-3 && Math.abs(points[1] - t[1]) < 1e-3;
}

const denominatorText = (n: number | null | undefined) => (n == null ? '' : String(n));

/** The form for a member's current settings. */
export function toSettingsForm(s: MemberBracingSettings, spanFt: number, units: UnitSystem): MemberSettingsForm {
  const b = s.bracing;
  let mode: BracingMode = 'auto';
  let points = '';
  if (b === 'continuous') mode = 'continuous';
  else if (b === 'none') mode = 'none';
  else if (b && typeof b === 'object') {
    const sorted = [...b.points_ft].sort((x, y) => x - y);
    mode = isThirds(sorted, spanFt) ? 'thirds' : 'points';
    points = sorted.map((x) => formatValue('length_ft', x, units, { digits: units === 'SI' ? 3 : 2 })).join(', ');
  }
  return {
    mode,
    points,
    lbOverride: s.Lb_override_ft == null ? '' : formatValue('length_ft', s.Lb_override_ft, units, { digits: units === 'SI' ? 3 : 2 }),
    liveLimit: denominatorText(s.deflectionLimits?.live),
    totalLimit: denominatorText(s.deflectionLimits?.total),
  };
}

function parseDenominator(text: string, which: string): { ok: true; value: number | null } | { ok: false; error: string } {
  const raw = text.trim().replace(/^L\s*\/\s*/i, '');
  if (raw === '') return { ok: true, value: null };
  if (!/^\d+(\.\d+)?$/.test(raw)) return { ok: false, error: `${which} limit: enter the n of span/n (e.g. 600), or leave it blank to follow the design basis` };
  const n = Number(raw);
  if (!(n > 0) || n > MAX_DENOMINATOR) return { ok: false, error: `${which} limit: n must be above 0 and at most ${MAX_DENOMINATOR}` };
  return { ok: true, value: n };
}

/**
 * The plan settings a form stands for, or the errors naming each field that is wrong.
 * Brace points must lie strictly inside the span; an Lb override must be above 0 and at most the span.
 */
export function fromSettingsForm(
  form: MemberSettingsForm,
  spanFt: number,
  units: UnitSystem,
): { ok: true; value: MemberBracingSettings } | { ok: false; errors: MemberSettingsErrors } {
  const errors: MemberSettingsErrors = {};
  let bracing: PlanBracing | null = null;
  const spanText = `${formatValue('length_ft', spanFt, units)} ${units === 'SI' ? 'm' : 'ft'}`;
  if (form.mode === 'continuous' || form.mode === 'none') bracing = form.mode;
  else if (form.mode === 'thirds') bracing = { points_ft: thirdPoints(spanFt) };
  else if (form.mode === 'points') {
    const parts = form.points.split(/[,;]/).map((p) => p.trim()).filter(Boolean);
    if (parts.length === 0) errors.points = 'Brace points: give at least one position from the start support, e.g. 10, 20';
    const xs: number[] = [];
    for (const part of parts) {
      const r = parseQuantity('length_ft', part, units);
      if (!r.ok) {
        errors.points = `Brace points: "${part}": ${r.error}`;
        break;
      }
      if (!(r.value > SAME_FT && r.value < spanFt - SAME_FT)) {
        errors.points = `Brace points: ${part} is not inside the span (0 to ${spanText})`;
        break;
      }
      xs.push(r.value);
    }
    if (!errors.points) {
      xs.sort((a, b) => a - b);
      bracing = { points_ft: xs.filter((x, i) => i === 0 || x - xs[i - 1] > SAME_FT) };
    }
  }
  let lb: number | null = null;
  if (form.lbOverride.trim() !== '') {
    const r = parseQuantity('length_ft', form.lbOverride, units);
    if (!r.ok) errors.lbOverride = `Lb override: ${r.error}`;
    else if (!(r.value > 0) || r.value > spanFt + SAME_FT) errors.lbOverride = `Lb override: must be above 0 and at most the span (${spanText}), or blank`;
    else lb = Math.min(r.value, spanFt);
  }
  const live = parseDenominator(form.liveLimit, 'Live-load deflection');
  if (!live.ok) errors.liveLimit = live.error;
  const total = parseDenominator(form.totalLimit, 'Total-load deflection');
  if (!total.ok) errors.totalLimit = total.error;
  if (Object.keys(errors).length > 0 || !live.ok || !total.ok) return { ok: false, errors };
  const deflectionLimits = live.value === null && total.value === null ? null : { live: live.value, total: total.value };
  return { ok: true, value: { bracing, Lb_override_ft: lb, deflectionLimits } };
}
