import * as fontkit from 'fontkit';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type PDFDocument from 'pdfkit';

export type Weight = 'regular' | 'bold';

/**
 * Inter as the app ships it (@fontsource/inter): one WOFF file per script subset. The report registers
 * each subset as a font of its own and sets each piece of text in the first subset that has its glyphs;
 * pdfkit embeds only the glyphs used.
 */
const SUBSETS = ['latin', 'latin-ext', 'greek', 'cyrillic'] as const;
const WEIGHTS: Record<Weight, number> = { regular: 400, bold: 600 };

interface LoadedFont {
  name: string;
  data: Buffer;
  font: fontkit.Font;
}

let loaded: Record<Weight, LoadedFont[]> | null = null;

function load(): Record<Weight, LoadedFont[]> {
  if (loaded) return loaded;
  const require = createRequire(import.meta.url);
  const of = (weight: Weight) =>
    SUBSETS.map((subset) => {
      const data = readFileSync(require.resolve(`@fontsource/inter/files/inter-${subset}-${WEIGHTS[weight]}-normal.woff`));
      return { name: `Inter-${WEIGHTS[weight]}-${subset}`, data, font: fontkit.create(data) as fontkit.Font };
    });
  loaded = { regular: of('regular'), bold: of('bold') };
  return loaded;
}

/** Registers every subset with a pdfkit document; call once per document. */
export function registerReportFonts(doc: InstanceType<typeof PDFDocument>): void {
  for (const weight of ['regular', 'bold'] as const) for (const f of load()[weight]) doc.registerFont(f.name, f.data);
}

/** The font name of the main (latin) subset, for measuring text. */
export const mainFont = (weight: Weight) => load()[weight][0].name;

/**
 * Text split into runs, each with the first subset that has all its glyphs. A character no subset has
 * (a script Inter's files do not cover) becomes "?", so the text stays selectable and honest about the gap.
 */
export function fontRuns(text: string, weight: Weight): { font: string; text: string }[] {
  const fonts = load()[weight];
  const runs: { font: string; text: string }[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    const f = cp < 0x80 || ch === '\n' ? fonts[0] : fonts.find((x) => x.font.hasGlyphForCodePoint(cp));
    const font = f?.name ?? fonts[0].name;
    const piece = f ? ch : '?';
    const last = runs[runs.length - 1];
    if (last && last.font === font) last.text += piece;
    else runs.push({ font, text: piece });
  }
  return runs;
}
