import "server-only";
import { buildSheetModel, type SheetInput, type SheetModel } from "@/lib/sheet";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadSheetInput } from "./load-sheet-input";

/**
 * What a device's draft sheet is built from, for someone who may read drafts (the
 * "sheet-drafts" resource): today's date, the approved data, the current limits and prose.
 * The workspace page, the JSON route and the PDF route all come through here.
 */
export async function loadDraftSheet(viewer: SessionUser, deviceId: number): Promise<SheetInput> {
  authorize(viewer, "sheet-drafts");
  return loadSheetInput({ organizationId: viewer.organizationId, deviceId, date: new Date().toISOString().slice(0, 10) });
}

/** The draft sheet model of a device as it stands now. */
export async function buildDraftSheet(viewer: SessionUser, deviceId: number): Promise<SheetModel> {
  return buildSheetModel(await loadDraftSheet(viewer, deviceId));
}
