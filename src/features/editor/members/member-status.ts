// The words, size and ratio shown for a member in the list, on the canvas and in tooltips.
import type { SchemeMember, SchemeResult } from '../../../../shared/engine/index';
import { utilisation, type Utilisation } from '../../../lib/utilisation';

export interface MemberStatus {
  mark: string;
  size: string;
  ratio: number | null;
  util: Utilisation;
  /** Plain words: "Passes — flexure governs", "Over — live-load deflection governs", "Not designed — …", "Problem — …". */
  words: string;
  /** Short reason for the canvas label when the member fails or was not designed. */
  shortReason: string | null;
  /** 'problem': sized, but the engine reports an error about it (e.g. an end that lands on nothing). */
  state: 'designing' | 'passes' | 'fails' | 'not-designed' | 'problem';
}

const GOVERNING_WORDS: Record<string, string> = {
  flexure: 'flexure',
  shear: 'shear',
  deflectionLive: 'live-load deflection',
  deflectionTotal: 'total-load deflection',
};

export function governingWords(governing: string | null | undefined): string {
  return governing ? (GOVERNING_WORDS[governing] ?? governing) : 'no check';
}

export function memberStatus(id: string, member: SchemeMember | undefined, result: SchemeResult | null, pending: boolean): MemberStatus {
  if (!result || (!member && pending)) {
    return { mark: '', size: '…', ratio: null, util: utilisation(Number.NaN), words: 'Designing…', shortReason: null, state: 'designing' };
  }
  const problem = result.problems.find((p) => p.elementId === id && p.severity === 'error');
  if (!member || !member.design) {
    const reason = cleanReason(problem?.message ?? 'the engine could not design it', id);
    return { mark: member?.mark ?? '', size: member?.shape ?? '—', ratio: null, util: utilisation(Number.NaN), words: `Not designed — ${reason}`, shortReason: shorten(reason), state: 'not-designed' };
  }
  const ratio = member.ratio ?? member.design.ratio;
  const util = utilisation(ratio);
  // A size that "passes" on a member the engine flags (no support at an end, …) is not a pass.
  if (problem && problem.code !== 'member-fails') {
    const reason = cleanReason(problem.message, id);
    return { mark: member.mark, size: member.shape ?? '—', ratio, util, words: `Problem — ${reason}`, shortReason: shorten(reason), state: 'problem' };
  }
  if (member.passes) {
    return { mark: member.mark, size: member.shape ?? '—', ratio, util, words: `Passes — ${governingWords(member.governing)} governs`, shortReason: null, state: 'passes' };
  }
  const reason = member.design.failure ? cleanReason(member.design.failure, id) : `${governingWords(member.governing)} governs`;
  return { mark: member.mark, size: member.shape ?? '—', ratio, util, words: `Over — ${reason}`, shortReason: shorten(reason), state: 'fails' };
}

/**
 * What the plan writes on a member, most to least informative; the canvas uses the first that
 * fits. A failing member reads like any other ("W16X26 1.82": the ratio over 1.00 and the
 * utilisation colour say it is over); why it fails lives in the tooltip and the Member sheet.
 */
export function memberChipTexts(s: MemberStatus): string[] {
  if (s.state === 'designing') return ['…'];
  if (s.state === 'not-designed') return ['not designed'];
  const sized = s.ratio === null ? s.size : `${s.size} ${s.util.printed}`;
  // A size that passes on a member with an error against it must not read as a pass.
  if (s.state === 'problem') return [`${sized} problem`, `${s.size} problem`];
  return sized === s.size ? [sized] : [sized, s.size];
}

/** Drop the "Member m7: " prefix the engine puts on plan problems. */
function cleanReason(message: string, id: string): string {
  return message.replace(new RegExp(`^Member ${id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}:?\\s*`), '').replace(/^could not be designed — /, '');
}

function shorten(text: string, max = 48): string {
  return text.length <= max ? text : `${text.slice(0, max - 1)}…`;
}
