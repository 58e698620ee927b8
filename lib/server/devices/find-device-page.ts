import "server-only";
import { Op, Sequelize, type FindAttributeOptions, type Order, type WhereOptions } from "sequelize";
import { deviceClassLabels } from "@/lib/domain/device-classes";
import { devicesPerPage, type DeviceListQuery, type DevicePage, type ListPage } from "@/lib/domain/devices";
import { db } from "@/models";
import type { Device } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { toDeviceSummary } from "./device-summary";

/** `%`, `_` and `\` typed into the search match themselves, not LIKE patterns. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * One page of an organization's devices, searched (part number or title contain the text,
 * case-insensitive by the column collation), sorted and counted in MariaDB. Part numbers sort
 * naturally (NATURAL_SORT_KEY, MariaDB ≥ 10.7: "KDX-9" before "KDX-10"); classes by their label.
 * A list that shows more than the device (the sheets index) adds its own columns as
 * `attributes` and may sort "updated" by its own expression (`updatedOrder`).
 */
export async function pageDevices<Row>(opts: {
  organizationId: number;
  query: DeviceListQuery;
  toRow: (device: Device) => Row;
  attributes?: FindAttributeOptions;
  updatedOrder?: ReturnType<typeof Sequelize.literal>;
}): Promise<ListPage<Row>> {
  const { Device } = db();
  const { organizationId, query } = opts;
  const where: WhereOptions<Device> = query.q
    ? { organizationId, [Op.or]: [{ partNumber: { [Op.like]: likePattern(query.q) } }, { title: { [Op.like]: likePattern(query.q) } }] }
    : { organizationId };
  const dir = query.dir === "asc" ? "ASC" : "DESC";
  const naturalPart = Sequelize.fn("NATURAL_SORT_KEY", Sequelize.col("part_number"));
  const classesByLabel = Object.entries(deviceClassLabels)
    .sort((a, b) => a[1].localeCompare(b[1], "en"))
    .map(([deviceClass]) => deviceClass);
  const first =
    query.sort === "class"
      ? Sequelize.fn("FIELD", Sequelize.col("device_class"), ...classesByLabel)
      : query.sort === "updated"
        ? (opts.updatedOrder ?? Sequelize.col("updated_at"))
        : naturalPart;
  const order: Order = [[first, dir], [naturalPart, dir], ["id", dir]];

  const [total, organizationTotal] = await Promise.all([Device.count({ where }), query.q ? Device.count({ where: { organizationId } }) : null]);
  const pageCount = Math.max(1, Math.ceil(total / devicesPerPage));
  const page = Math.min(query.page, pageCount);
  const rows = await Device.findAll({ where, attributes: opts.attributes, order, limit: devicesPerPage, offset: (page - 1) * devicesPerPage });
  return { rows: rows.map(opts.toRow), total, organizationTotal: organizationTotal ?? total, page, pageCount };
}

/** The device list page: one page of the viewer's organization's devices. */
export async function findDevicePage(viewer: SessionUser, query: DeviceListQuery): Promise<DevicePage> {
  const { organizationId } = authorize(viewer, "devices");
  return pageDevices({ organizationId, query, toRow: toDeviceSummary });
}
