import "server-only";
import { Sequelize } from "sequelize";
import type { DeviceListQuery } from "@/lib/domain/devices";
import type { SheetPage, SheetSummary } from "@/lib/domain/sheets";
import type { Device } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { pageDevices } from "../devices/find-device-page";


// Correlated subqueries run for the page's rows only (25 at most); each walks an index that
// starts with device_id (measurement_sets_device_sha256, spec_limits_device_parameter_conditions,
// sheet_contents.device_id).
const currentSets = "FROM measurement_sets ms WHERE ms.device_id = `Device`.`id` AND ms.superseded_by_id IS NULL";
const lastChange =
  "GREATEST(`Device`.`updated_at`," +
  " COALESCE((SELECT MAX(ms.updated_at) FROM measurement_sets ms WHERE ms.device_id = `Device`.`id`), `Device`.`updated_at`)," +
  " COALESCE((SELECT MAX(sl.updated_at) FROM spec_limits sl WHERE sl.device_id = `Device`.`id`), `Device`.`updated_at`)," +
  " COALESCE((SELECT sc.updated_at FROM sheet_contents sc WHERE sc.device_id = `Device`.`id`), `Device`.`updated_at`))";

const summaryColumns: [ReturnType<typeof Sequelize.literal>, string][] = [
  [Sequelize.literal(`(SELECT COUNT(*) ${currentSets} AND ms.state = 'approved')`), "approved_set_count"],
  [Sequelize.literal(`(SELECT COUNT(DISTINCT JSON_VALUE(ms.conditions, '$.serial')) ${currentSets} AND ms.state = 'approved')`), "unit_count"],
  [Sequelize.literal(`(SELECT COUNT(*) ${currentSets} AND ms.state = 'submitted')`), "awaiting_review_count"],
  [Sequelize.literal("(SELECT COUNT(*) FROM spec_limits sl WHERE sl.device_id = `Device`.`id`)"), "limit_count"],
  [Sequelize.literal(lastChange), "last_change_at"],
  // The open candidate's state (one per device, by the unique open_device_id), and the newest revision's letter.
  [Sequelize.literal("(SELECT sc.state FROM sheet_candidates sc WHERE sc.open_device_id = `Device`.`id`)"), "review_state"],
  [Sequelize.literal("(SELECT sr.letter FROM sheet_revisions sr WHERE sr.device_id = `Device`.`id` ORDER BY sr.sequence DESC LIMIT 1)"), "latest_revision"],
];

function toSheetSummary(device: Device): SheetSummary {
  const count = (name: string) => Number(device.get(name) ?? 0);
  const changed = device.get("last_change_at");
  return {
    deviceId: device.id,
    partNumber: device.partNumber,
    deviceClass: device.deviceClass,
    title: device.title,
    approvedSetCount: count("approved_set_count"),
    unitCount: count("unit_count"),
    awaitingReviewCount: count("awaiting_review_count"),
    limitCount: count("limit_count"),
    lastChangeAt: (changed instanceof Date ? changed : new Date(String(changed))).toISOString(),
    reviewState: (device.get("review_state") as SheetSummary["reviewState"]) ?? null,
    latestRevision: (device.get("latest_revision") as string | null) ?? null,
  };
}

/**
 * The sheets index: one page of the organization's draft sheets, searched, sorted and paged
 * like the device list (the same query), with counts from the database. Nothing here builds a
 * sheet model, so the page costs the same for ten devices or ten thousand; what only the model
 * knows (flagged groups, open issues) is on each draft's own page.
 */
export async function findSheetPage(viewer: SessionUser, query: DeviceListQuery): Promise<SheetPage> {
  const { organizationId } = authorize(viewer, "sheet-drafts");
  return pageDevices({
    organizationId,
    query,
    toRow: toSheetSummary,
    attributes: ["id", "partNumber", "deviceClass", "title", "updatedAt", ...summaryColumns],
    updatedOrder: Sequelize.literal(lastChange),
  });
}
