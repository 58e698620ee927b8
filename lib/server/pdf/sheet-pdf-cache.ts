import "server-only";
import { createHash } from "node:crypto";
import { serializeSheetModel, type SheetModel } from "../../sheet";
import { KeptResults } from "../kept-results";
import { sheetPdfRenderPool } from "./pdf-render-pool";

/** The model's digest: the same model always gives the same PDF content, so it names the PDF. */
export function sheetModelDigest(model: SheetModel): string {
  return createHash("sha256").update(serializeSheetModel(model)).digest("hex");
}

// A PDF render costs a worker most of a second. The preview reloads the same draft after every
// save and customers download the same revision again and again, so the last few PDFs are kept by
// model digest (about 0.4 MB each), oldest out first: the bytes, not the promise of the request
// that asked first (lib/server/kept-results.ts). A failed render is not kept.
const pdfs = new KeptResults<Buffer>(16);

/** The sheet's PDF, rendered once per distinct model while it stays among the last few asked for. */
export function sheetPdfFor(model: SheetModel, digest = sheetModelDigest(model)): Promise<Buffer> {
  return pdfs.get(digest, () => sheetPdfRenderPool().render(model));
}
