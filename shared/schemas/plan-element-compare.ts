/**
 * Whether two versions of one plan element say the same thing. A member's issued mark (its
 * `mark` without `markLocked`) is derived from the design, kept only so it stays put; it is
 * not an edit, so it never makes two versions differ (nor a save conflict).
 */
import type { PlanMember } from './plan.schema';

function withoutIssuedMark(member: PlanMember): PlanMember {
  if (member.markLocked || member.mark === undefined) return member;
  const { mark: _issued, ...rest } = member;
  return rest;
}

/** The element as it counts for comparison (members without an issued mark). */
export function comparableElement(kind: string, element: object): object {
  return kind === 'members' ? withoutIssuedMark(element as PlanMember) : element;
}

export function sameElement(kind: string, a: object, b: object): boolean {
  if (a === b) return true;
  return JSON.stringify(comparableElement(kind, a)) === JSON.stringify(comparableElement(kind, b));
}
