import type { SchemeMember, SchemeResult } from '../../shared/engine/index';

/** How much of the scheme `calc plan` prints (calc-interface.md fields are in every view but summary). */
export type PlanOutputView = 'summary' | 'default' | 'detail';

/** Per-member fields only `--detail` prints: the full sizing record and the load list (repeated text per member). */
const DETAIL_ONLY = new Set<string>(['design', 'loads']);
/** Fields the summary keeps per member when the engine reports them (composite beams add these). */
const SUMMARY_OPTIONAL = ['studs', 'camber_in', 'percentComposite'] as const;

function summaryMember(m: SchemeMember): Record<string, unknown> {
  const out: Record<string, unknown> = { id: m.id, mark: m.mark, shape: m.shape, passes: m.passes, ratio: m.ratio, governing: m.governing };
  for (const k of SUMMARY_OPTIONAL) if (k in m) out[k] = (m as unknown as Record<string, unknown>)[k];
  out.reactions = m.reactions;
  return out;
}

function defaultMember(m: SchemeMember): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(m)) if (!DETAIL_ONLY.has(k)) out[k] = (m as unknown as Record<string, unknown>)[k];
  return out;
}

/**
 * The document `calc plan` prints. detail: everything the engine returns. default: every field but
 * each member's sizing record and load list (`--detail` adds them). summary: per member id, mark,
 * shape, passes, ratio, governing, studs/camber where present and reactions; columns, totals, problems.
 */
export function planOutput(result: SchemeResult & { repairs: string[] }, view: PlanOutputView): unknown {
  if (view === 'detail') return result;
  if (view === 'default') return { ...result, members: result.members.map(defaultMember) };
  return {
    name: result.name,
    members: result.members.map(summaryMember),
    columns: result.columns,
    totals: result.totals,
    problems: result.problems,
    caution: result.caution,
  };
}
