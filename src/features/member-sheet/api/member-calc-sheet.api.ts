/** GET /api/schemes/:id/members/:memberId/calc-sheet.pdf: one member's calc sheet (a download link, no fetcher). */
export function memberCalcSheetHref(schemeId: string, memberId: string): string {
  return `/api/schemes/${encodeURIComponent(schemeId)}/members/${encodeURIComponent(memberId)}/calc-sheet.pdf`;
}
