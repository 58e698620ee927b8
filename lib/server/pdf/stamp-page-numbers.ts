import "server-only";
import { EventEmitter } from "node:events";
import { readFileSync } from "node:fs";
// fontkit 2 (react-pdf's own) has no type declarations.
// @ts-expect-error no types
import * as fontkit from "fontkit";
import { PDFArray, PDFDict, PDFDocument, PDFName, rgb } from "pdf-lib";

export interface PageNumberStyle {
  /** Right edge of the text, in points from the page's left edge. */
  right: number;
  /** Baseline, in points from the page's bottom edge. */
  baseline: number;
  size: number;
  /** "#RRGGBB" */
  color: string;
  /** TTF file of the face to draw with. */
  fontFile: string;
  /** Name the embedded subset carries, without its tag (e.g. "SourceSans3-Regular"). */
  fontName: string;
}

// PDF 32000-1:2008 §9.6.4: a subset font's name starts with six upper-case letters and "+".
const SUBSET_TAG = "BFDPGN";

const fontBytes = new Map<string, Uint8Array>();

type Subset = { encode(): Uint8Array; encodeStream?: () => EventEmitter };
type FontkitFont = { createSubset(): Subset };

/**
 * pdf-lib lays out and subsets text with a fontkit it is given. Its usual companion package
 * drew the wrong glyphs from Source Sans 3's subset (checked with pdftoppm), so it gets
 * fontkit 2, the one react-pdf embeds with, and the one method it expects of fontkit 1:
 * `encodeStream()` on a subset, served from fontkit 2's `encode()`.
 */
const fontkitForPdfLib = {
  create(data: Uint8Array) {
    const font = (fontkit as { create(data: Buffer): FontkitFont }).create(Buffer.from(data));
    const createSubset = font.createSubset.bind(font);
    font.createSubset = () => {
      const subset = createSubset();
      subset.encodeStream = () => {
        const stream = new EventEmitter();
        queueMicrotask(() => {
          try {
            stream.emit("data", subset.encode());
            stream.emit("end");
          } catch (error) {
            stream.emit("error", error);
          }
        });
        return stream;
      };
      return subset;
    };
    return font;
  },
};

function hexColor(hex: string) {
  const n = Number.parseInt(hex.replace("#", ""), 16);
  return rgb(((n >> 16) & 255) / 255, ((n >> 8) & 255) / 255, (n & 255) / 255);
}

/**
 * Writes "Page k of N" on every page of a finished PDF. react-pdf can number pages itself, but a
 * page carrying a page-number render callback is laid out again at every break and once more at
 * the end, which was a third of a sheet's PDF time; stamping afterwards costs a few tens of ms.
 */
export async function stampPageNumbers(pdf: Uint8Array, style: PageNumberStyle): Promise<Buffer> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  doc.registerFontkit(fontkitForPdfLib as unknown as Parameters<typeof doc.registerFontkit>[0]);
  let bytes = fontBytes.get(style.fontFile);
  if (!bytes) fontBytes.set(style.fontFile, (bytes = readFileSync(style.fontFile)));
  const font = await doc.embedFont(bytes, { subset: true });
  const color = hexColor(style.color);
  const pages = doc.getPages();
  pages.forEach((page, k) => {
    const text = `Page ${k + 1} of ${pages.length}`;
    page.drawText(text, { x: style.right - font.widthOfTextAtSize(text, style.size), y: style.baseline, size: style.size, font, color });
  });
  // Embed now (save() would do it) so the subset can carry a proper subset name.
  await font.embed();
  const name = PDFName.of(`${SUBSET_TAG}+${style.fontName}`);
  const type0 = doc.context.lookup(font.ref, PDFDict);
  type0.set(PDFName.of("BaseFont"), name);
  const cidFont = type0.lookup(PDFName.of("DescendantFonts"), PDFArray).lookup(0, PDFDict);
  cidFont.set(PDFName.of("BaseFont"), name);
  cidFont.lookup(PDFName.of("FontDescriptor"), PDFDict).set(PDFName.of("FontName"), name);
  return Buffer.from(await doc.save({ useObjectStreams: false }));
}
