/**
 * What a member's own settings change in its design, and where each figure used comes from:
 * the unbraced length (design-basis §3: derived from the framing and deck, or set on the member
 * as bracing and/or an Lb override) and the deflection limits (design-basis §5: the design
 * basis, or set on the member). Pure; the scheme design, the Member sheet and the calc sheet
 * all read these, so the figure designed is the figure shown.
 */
import type { PlanDesignBasis, PlanMember } from '../../schemas/plan.schema';

export type SettingSource = 'member' | 'basis';

export interface DeflectionLimitsUsed {
  /** Denominators n of span/n; null: not checked (the design basis skips it and the member sets none). */
  live: number | null;
  total: number | null;
  source: { live: SettingSource; total: SettingSource };
}

/** The deflection limits a member is designed to: its own where it sets one, else the design basis. */
export function memberDeflectionLimits(basis: Pick<PlanDesignBasis, 'deflectionLimits'>, member: Pick<PlanMember, 'deflectionLimits'>): DeflectionLimitsUsed {
  const own = member.deflectionLimits ?? null;
  const live = own?.live ?? null;
  const total = own?.total ?? null;
  return {
    live: live ?? basis.deflectionLimits.live,
    total: total ?? basis.deflectionLimits.total,
    source: { live: live !== null ? 'member' : 'basis', total: total !== null ? 'member' : 'basis' },
  };
}

export interface BracingUsed {
  /** 'member': bracing set on the member; 'basis': derived from the framing and deck (design-basis §3). */
  bracing: SettingSource;
  /** The Lb override set on the member (every segment, Cb = 1.0), or null. */
  Lb_override_ft: number | null;
}

export function memberBracingSource(member: Pick<PlanMember, 'bracing' | 'Lb_override_ft'>): BracingUsed {
  return { bracing: member.bracing ? 'member' : 'basis', Lb_override_ft: member.Lb_override_ft ?? null };
}
