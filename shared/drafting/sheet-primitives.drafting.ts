/**
 * The drawing primitives of a sheet: what the PDF renderer (server/pdf) and the in-app SVG
 * renderer (src/features/plan-sheet) both draw, so the two show one geometry. Sheet
 * coordinates are PostScript points (72 per inch), origin at the top-left corner, y down.
 * Text is placed on its alphabetic baseline; `rotate` turns it about (x, y), degrees,
 * clockwise as seen on the sheet.
 */

export type SheetFont = 'sans' | 'sans-bold' | 'mono' | 'mono-bold';
/** 'ink' full black linework and text; 'soft' grey for grid lines and dimensions. */
export type SheetTone = 'ink' | 'soft';
export type SheetFill = 'ink' | 'paper' | 'none';

export type SheetPrimitive =
  | { type: 'line'; x1: number; y1: number; x2: number; y2: number; weight: number; tone?: SheetTone; dash?: number[]; ref?: string }
  | { type: 'polygon'; points: [number, number][]; weight: number; fill: SheetFill; tone?: SheetTone; closed: boolean }
  | { type: 'circle'; cx: number; cy: number; r: number; weight: number; fill: SheetFill; tone?: SheetTone }
  | { type: 'rect'; x: number; y: number; w: number; h: number; weight: number; fill: SheetFill; tone?: SheetTone }
  | {
      type: 'text';
      x: number;
      y: number;
      text: string;
      size: number;
      font: SheetFont;
      anchor: 'start' | 'middle' | 'end';
      rotate?: number;
      tone?: SheetTone;
      ref?: string;
    };

export interface SheetDocument {
  width_pt: number;
  height_pt: number;
  primitives: SheetPrimitive[];
}

export const PT_PER_IN = 72;
/** ANSI B (tabloid, 11 × 17 in) landscape. */
export const TABLOID_LANDSCAPE = { width_pt: 17 * PT_PER_IN, height_pt: 11 * PT_PER_IN } as const;

/** Advance widths in em: JetBrains Mono is monospaced at 600/1000; Inter is estimated per class, on the wide side. */
export function estimateTextWidth(text: string, size: number, font: SheetFont): number {
  if (font === 'mono' || font === 'mono-bold') return text.length * 0.6 * size;
  let em = 0;
  for (const ch of text) {
    if (ch === ' ') em += 0.28;
    else if (/[A-Z0-9]/.test(ch)) em += ch === 'I' || ch === '1' ? 0.4 : ch === 'M' || ch === 'W' ? 0.85 : 0.68;
    else if (/[a-z]/.test(ch)) em += ch === 'i' || ch === 'l' || ch === 'j' ? 0.27 : ch === 'm' || ch === 'w' ? 0.82 : 0.56;
    else if (/[.,:;'|!]/.test(ch)) em += 0.3;
    else em += 0.62;
  }
  return em * size * (font === 'sans-bold' ? 1.06 : 1);
}

/** Greedy word wrap to a width, by the estimate above. */
export function wrapText(text: string, size: number, font: SheetFont, maxWidth: number): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split('\n')) {
    let line = '';
    for (const word of paragraph.split(/\s+/).filter(Boolean)) {
      const next = line ? `${line} ${word}` : word;
      if (line && estimateTextWidth(next, size, font) > maxWidth) {
        lines.push(line);
        line = word;
      } else line = next;
    }
    lines.push(line);
  }
  return lines;
}
