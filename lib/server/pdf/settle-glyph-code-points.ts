import "server-only";
import { Font } from "@react-pdf/renderer";

type GlyphTable = { characterSet: number[]; glyphForCodePoint(codePoint: number): unknown };

let settled = false;

/**
 * fontkit keeps one glyph object per glyph id for the life of a loaded font, carrying the code
 * points it was first reached by, and the PDF's ToUnicode map (what copying text or pdftotext
 * reads) is written from them. A subset also reaches the parts of a composite glyph by id alone:
 * Source Code Pro's hyphen is drawn from its minus, so one sheet with a hyphen and no minus in
 * the figure font left the minus glyph without a code point, and every later PDF of the process
 * lost its minus signs from the text (the page still drew them). Reaching every mapped code
 * point once, before the first PDF, gives each glyph its own.
 */
export async function settleGlyphCodePoints(): Promise<void> {
  if (settled) return;
  for (const family of Object.values(Font.getRegisteredFonts())) {
    for (const source of family.sources) {
      await source.load();
      const table = source.data as GlyphTable | null;
      if (table && Array.isArray(table.characterSet)) for (const codePoint of table.characterSet) table.glyphForCodePoint(codePoint);
    }
  }
  settled = true;
}
