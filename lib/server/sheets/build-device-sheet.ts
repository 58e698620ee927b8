import "server-only";
import { buildSheetModel, type SheetModel } from "@/lib/sheet";
import { loadSheetInput } from "./load-sheet-input";

/** The draft sheet of a device as it stands now: today's date, the approved data, the current limits and prose. */
export async function buildDeviceSheet(opts: { organizationId: number; deviceId: number }): Promise<SheetModel> {
  const input = await loadSheetInput({ ...opts, date: new Date().toISOString().slice(0, 10) });
  return buildSheetModel(input);
}
