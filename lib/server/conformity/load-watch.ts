import "server-only";
import { Op, type Transaction } from "sequelize";
import type { SheetModel } from "@/lib/sheet";
import type { Curve } from "@/lib/analysis/types";
import type { WatchedSet } from "@/lib/sheet/conformity-watch";
import type { SheetTemplate } from "@/templates/types";
import { findSheetTemplate } from "@/templates";
import { db } from "@/models";

export type WatchInput = {
  revision: { id: number; letter: string; releasedAt: Date };
  model: SheetModel;
  template: SheetTemplate;
  /** Approved, not superseded sets reviewed after the release, oldest approval first. */
  sets: (WatchedSet & { id: number })[];
};

/**
 * What the watch of one device reads: its current revision (the newest, unless withdrawn: then the
 * device has none and nothing is watched), that revision's frozen model, the device class's template,
 * and the sets approved since the release. Null when there is no current revision.
 */
export async function loadWatchInput(opts: { organizationId: number; deviceId: number; transaction?: Transaction }): Promise<WatchInput | null> {
  const { SheetRevision, SheetRevisionWithdrawal, MeasurementSet, Device } = db();
  const { organizationId, deviceId, transaction } = opts;
  const newest = await SheetRevision.unscoped().findOne({
    where: { organizationId, deviceId },
    attributes: ["id", "letter", "releasedAt", "modelJson"],
    order: [["sequence", "DESC"]],
    transaction,
  });
  if (!newest) return null;
  const withdrawn = await SheetRevisionWithdrawal.count({ where: { revisionId: newest.id }, transaction });
  if (withdrawn) return null;
  const model = JSON.parse(newest.modelJson) as SheetModel;
  const device = await Device.findByPk(deviceId, { attributes: ["deviceClass"], transaction });
  const stated = { driveLevelDbm: model.template.statedDriveDbm };
  const template = findSheetTemplate(model.template.deviceClass, stated) ?? (device ? findSheetTemplate(device.deviceClass, stated) : undefined);
  if (!template) return null;
  const rows = await MeasurementSet.findAll({
    where: { organizationId, deviceId, state: "approved", supersededById: { [Op.is]: null }, reviewedAt: { [Op.gt]: newest.releasedAt } },
    attributes: ["id", "kind", "conditions", "measuredOn", "parameters", "curves", "reviewedAt"],
    order: [
      ["reviewedAt", "ASC"],
      ["id", "ASC"],
    ],
    transaction,
  });
  return {
    revision: { id: newest.id, letter: newest.letter, releasedAt: newest.releasedAt },
    model,
    template,
    sets: rows.map((s) => ({
      id: s.id,
      kind: s.kind,
      serial: s.conditions.serial,
      lot: s.conditions.lot,
      temperatureC: s.conditions.temperatureC,
      measuredOn: s.measuredOn ?? "",
      parameters: s.parameters,
      curves: (s.curves ?? []) as Curve[],
    })),
  };
}
