/**
 * Checks on an uploaded package-outline drawing before anything is stored (pure). A PNG must carry
 * the PNG signature and a well-formed IHDR chunk (ISO/IEC 15948:2004 §5.2, §11.2.2) within the size
 * and pixel limits; an SVG is refused when it could reach outside itself (scripts, external or
 * embedded resources, entity declarations) and is then rasterised to PNG on the server, so the
 * sheet never serves an uploaded SVG.
 */

export const packageOutlineLimits = {
  /** Bytes of an upload, SVG or PNG. */
  uploadBytes: 1024 * 1024,
  /** Bytes of the PNG the sheet prints (it travels inside the sheet model). */
  pngBytes: 512 * 1024,
  /** Pixels along either side of a PNG. */
  sidePx: 4000,
  /** Width an SVG is rasterised to. */
  rasterWidthPx: 1200,
} as const;

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

export type OutlineCheck = { ok: true; widthPx: number; heightPx: number } | { ok: false; message: string };

/** The PNG's size from its IHDR chunk, or why the bytes are not an acceptable PNG. */
export function checkPng(bytes: Uint8Array): OutlineCheck {
  if (bytes.byteLength > packageOutlineLimits.pngBytes) {
    return { ok: false, message: `The PNG is ${bytes.byteLength} bytes; a package outline may be at most ${packageOutlineLimits.pngBytes} bytes.` };
  }
  if (bytes.byteLength < 33 || PNG_SIGNATURE.some((b, i) => bytes[i] !== b)) return { ok: false, message: "The file is not a PNG: it does not start with the PNG signature." };
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const chunkType = String.fromCharCode(...bytes.subarray(12, 16));
  if (view.getUint32(8) !== 13 || chunkType !== "IHDR") return { ok: false, message: "The PNG's first chunk is not a 13-byte IHDR header." };
  const widthPx = view.getUint32(16);
  const heightPx = view.getUint32(20);
  if (widthPx === 0 || heightPx === 0) return { ok: false, message: "The PNG has no pixels (width or height 0)." };
  if (widthPx > packageOutlineLimits.sidePx || heightPx > packageOutlineLimits.sidePx) {
    return { ok: false, message: `The PNG is ${widthPx} × ${heightPx} pixels; each side may be at most ${packageOutlineLimits.sidePx}.` };
  }
  return { ok: true, widthPx, heightPx };
}

/** Elements and attributes that would let a drawing run code or load anything beyond itself. */
const SVG_REFUSALS: [RegExp, string][] = [
  [/<!DOCTYPE|<!ENTITY/i, "a DOCTYPE or entity declaration"],
  [/<\s*script\b/i, "a script element"],
  [/<\s*foreignObject\b/i, "a foreignObject element"],
  [/<\s*(?:image|use|feImage)\b[^>]*\bhref\s*=\s*["']\s*(?!#)/i, "a reference to another file or address (href other than #id)"],
  [/<\s*image\b/i, "an embedded image"],
  [/\son[a-z]+\s*=/i, "an event-handler attribute (on…)"],
  [/url\(\s*["']?\s*(?!#)/i, "a url() that is not a #id in the drawing"],
  [/@import\b/i, "a stylesheet @import"],
  [/<\?xml-stylesheet/i, "an xml-stylesheet instruction"],
];

/** Null when the SVG text is safe to rasterise; otherwise the sentence that refuses it. */
export function refuseSvg(text: string): string | null {
  if (!/<svg[\s>]/i.test(text)) return "The file is not an SVG drawing: no <svg> element.";
  for (const [pattern, what] of SVG_REFUSALS) {
    if (pattern.test(text)) return `The SVG contains ${what}; upload a plain drawing (paths, shapes and text) or a PNG.`;
  }
  return null;
}

/** Which kind the bytes are, by content (never by the name or the declared type alone). */
export function sniffOutlineKind(bytes: Uint8Array): "png" | "svg" | null {
  if (PNG_SIGNATURE.every((b, i) => bytes[i] === b)) return "png";
  const head = new TextDecoder("utf-8", { fatal: false }).decode(bytes.subarray(0, 1024)).replace(/^\uFEFF/, "").trimStart();
  if (/^(?:<\?xml[^>]*>\s*)?(?:<!--[\s\S]*?-->\s*)*<svg[\s>]/i.test(head)) return "svg";
  return null;
}
