import "server-only";
import type { DesignDataInput } from "@/lib/sheet/types";
import { db } from "@/models";
import type { SheetContent } from "@/models";
import { readStoredFile } from "../storage/store-file";

/**
 * The design-in data of a device's sheet as the model builder takes it: the stated lists, and the
 * package outline's PNG read from its stored file (same organization) with its SHA-256.
 */
export async function loadDesignData(content: SheetContent | null, organizationId: number): Promise<DesignDataInput | undefined> {
  if (!content) return undefined;
  const pinFunctions = content.pinFunctions ?? [];
  const ordering = content.orderingInformation ?? [];
  const recommendedOperatingConditions = content.recommendedOperatingConditions ?? [];
  let packageOutline: DesignDataInput["packageOutline"] = null;
  if (content.packageOutlineFileId) {
    const file = await db().StoredFile.unscoped().findOne({ where: { id: content.packageOutlineFileId, organizationId } });
    if (file) {
      const bytes = await readStoredFile(file);
      // IHDR width and height (checked when the drawing was stored: lib/sheet/package-outline.ts).
      packageOutline = {
        caption: content.packageOutlineCaption ?? "",
        sha256: file.sha256,
        widthPx: bytes.readUInt32BE(16),
        heightPx: bytes.readUInt32BE(20),
        pngBase64: bytes.toString("base64"),
      };
    }
  }
  const packageOutlineCaption = content.packageOutlineCaption ?? "";
  if (!pinFunctions.length && !ordering.length && !recommendedOperatingConditions.length && !packageOutline && !packageOutlineCaption) return undefined;
  return { pinFunctions, ordering, recommendedOperatingConditions, packageOutline, packageOutlineCaption };
}
