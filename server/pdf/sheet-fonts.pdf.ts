import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { SheetFont } from '../../shared/drafting/sheet-primitives.drafting';

// The app's own type families as TrueType for PDF embedding: Inter and JetBrains Mono (SIL
// Open Font License), shipped by @expo-google-fonts/inter and /jetbrains-mono. The app's
// @fontsource .woff2 files cannot be embedded by pdfkit. PDF's built-in Helvetica/Courier
// are the fallback only when those packages are missing.

const FILES: Record<SheetFont, string> = {
  sans: '@expo-google-fonts/inter/400Regular/Inter_400Regular.ttf',
  'sans-bold': '@expo-google-fonts/inter/600SemiBold/Inter_600SemiBold.ttf',
  mono: '@expo-google-fonts/jetbrains-mono/400Regular/JetBrainsMono_400Regular.ttf',
  'mono-bold': '@expo-google-fonts/jetbrains-mono/700Bold/JetBrainsMono_700Bold.ttf',
};

const FALLBACK: Record<SheetFont, string> = {
  sans: 'Helvetica',
  'sans-bold': 'Helvetica-Bold',
  mono: 'Courier',
  'mono-bold': 'Courier-Bold',
};

export interface SheetFontSource {
  font: SheetFont;
  /** TrueType bytes, or null to use the built-in fallback `standard`. */
  data: Buffer | null;
  standard: string;
}

let cached: SheetFontSource[] | null = null;

export function sheetFonts(): SheetFontSource[] {
  if (cached) return cached;
  const require = createRequire(import.meta.url);
  cached = (Object.keys(FILES) as SheetFont[]).map((font) => {
    let data: Buffer | null = null;
    try {
      const path = require.resolve(FILES[font]);
      if (existsSync(path)) data = readFileSync(path);
    } catch {
      data = null;
    }
    return { font, data, standard: FALLBACK[font] };
  });
  return cached;
}

/** True when every sheet font is the app's own TrueType (false means the Helvetica fallback is in use). */
export function sheetFontsEmbedded(): boolean {
  return sheetFonts().every((f) => f.data !== null);
}
