import "server-only";
import { Resvg } from "@resvg/resvg-js";
import { AppError } from "@/lib/errors";
import { checkPng, packageOutlineLimits, refuseSvg, sniffOutlineKind } from "@/lib/sheet/package-outline";
import { fontFiles, SANS_FAMILY } from "../pdf/fonts";

export type OutlineUpload = { name: string; bytes: Uint8Array };

/**
 * The PNG the sheet prints for an uploaded drawing: a PNG as it is, once its signature, header and
 * size pass; an SVG refused if it could reach beyond itself, then rasterised here with resvg (no
 * system fonts, no external files), so no uploaded SVG is ever served.
 */
export function outlinePng(upload: OutlineUpload): { png: Buffer; widthPx: number; heightPx: number } {
  const kind = sniffOutlineKind(upload.bytes);
  if (!kind) throw new AppError("unsupported-media-type", `${upload.name} is neither a PNG nor an SVG drawing.`, { field: "file" });
  let png: Buffer;
  if (kind === "png") {
    png = Buffer.from(upload.bytes);
  } else {
    const text = new TextDecoder("utf-8", { fatal: false }).decode(upload.bytes);
    const refusal = refuseSvg(text);
    if (refusal) throw new AppError("invalid", refusal, { field: "file" });
    try {
      const resvg = new Resvg(text, {
        font: { fontFiles: [fontFiles.sansRegular, fontFiles.sansSemiBold, fontFiles.monoRegular], loadSystemFonts: false, defaultFontFamily: SANS_FAMILY },
        fitTo: { mode: "width", value: packageOutlineLimits.rasterWidthPx },
        background: "#ffffff",
      });
      // A drawing far taller than wide would be rasterised into a huge bitmap at the fixed width: refused before drawing.
      const heightPx = Math.ceil((packageOutlineLimits.rasterWidthPx * resvg.height) / resvg.width);
      if (!(heightPx > 0) || heightPx > packageOutlineLimits.sidePx) {
        throw new AppError("invalid", `The SVG is ${resvg.width} × ${resvg.height} units; drawn ${packageOutlineLimits.rasterWidthPx} pixels wide it would be ${heightPx} pixels tall, more than ${packageOutlineLimits.sidePx}.`, { field: "file" });
      }
      png = Buffer.from(resvg.render().asPng());
    } catch (error) {
      if (error instanceof AppError) throw error;
      throw new AppError("invalid", `${upload.name} could not be drawn as SVG: ${(error as Error).message.slice(0, 200)}`, { field: "file" });
    }
  }
  const check = checkPng(png);
  if (!check.ok) throw new AppError(check.message.includes("at most") ? "payload-too-large" : "invalid", check.message, { field: "file" });
  return { png, widthPx: check.widthPx, heightPx: check.heightPx };
}
