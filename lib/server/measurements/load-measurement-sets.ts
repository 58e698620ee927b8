import "server-only";
import type { WhereOptions } from "sequelize";
import { db } from "@/models";
import type { MeasurementSet } from "@/models";
import { toMeasurementSetSummary, type MeasurementSetSummary } from "./measurement-set-summary";

/** The one query behind every list and detail of measurement sets; the caller's `where` carries the organization. */
export async function loadMeasurementSets(where: WhereOptions<MeasurementSet>): Promise<MeasurementSetSummary[]> {
  const { BenchToken, Device, Instrument, MeasurementSet, StoredFile, User } = db();
  const rows = await MeasurementSet.findAll({
    where,
    include: [
      { model: Device, attributes: ["partNumber"] },
      { model: StoredFile, attributes: ["originalName", "sizeBytes"] },
      { model: User, as: "uploadedBy", attributes: ["name"] },
      { model: User, as: "reviewedBy", attributes: ["name"] },
      { model: BenchToken, as: "benchToken", attributes: ["name"] },
      { model: Instrument, attributes: ["id", "kind", "model", "serial", "calibrationDueOn"], through: { attributes: ["calibrationLapsed"] } },
    ],
    order: [["createdAt", "DESC"], ["id", "DESC"]],
  });
  return rows.map(toMeasurementSetSummary);
}
