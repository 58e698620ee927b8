import sharp from "sharp";

/** A small line drawing of a package (SVG text), as an engineer's CAD export might look. */
export const outlineSvg = `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" width="300" height="200" viewBox="0 0 300 200">
  <rect x="50" y="40" width="200" height="120" fill="none" stroke="#000" stroke-width="2"/>
  <line x1="20" y1="100" x2="50" y2="100" stroke="#000"/>
  <text x="150" y="190" font-size="14" text-anchor="middle">3.00 ± 0.10</text>
</svg>`;

/** A PNG of the given size made by sharp (libvips): an encoder outside the project. */
export function makePng(widthPx: number, heightPx: number): Promise<Buffer> {
  return sharp({ create: { width: widthPx, height: heightPx, channels: 3, background: { r: 250, g: 250, b: 245 } } }).png().toBuffer();
}
