/** Where the browser downloads a scheme's plan file (Content-Disposition: attachment). */
export function schemeExportUrl(schemeId: string): string {
  return `/api/schemes/${encodeURIComponent(schemeId)}/export`;
}
