import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import type { SheetInput } from "@/lib/sheet";
import type { Curve } from "@/lib/analysis";
import { db } from "@/models";
import type { MeasurementSet, Instrument, Device, Organization, SpecLimit } from "@/models";
import { openConformityIssues } from "../conformity/get-conformity-watch";
import { loadDesignData } from "./load-design-data";
import { isPlausibilityWarning } from "@/lib/ingest/plausibility-warning";

type SetWithInstruments = MeasurementSet & { Instruments?: Instrument[] };

/**
 * Everything the sheet of one device is built from, read in one place: the device, its
 * approved and not superseded measurement sets (with curves and instruments), its spec
 * limits, the engineer's prose and ratings, and the organization's statistical settings.
 */
export async function loadSheetInput(opts: {
  organizationId: number;
  deviceId: number;
  date: string;
  /** The revision the sheet is built as; a draft (no letter, no history) unless given. */
  revision?: Omit<SheetInput["revision"], "date">;
}): Promise<SheetInput> {
  const { Device, Instrument, MeasurementSet, Organization, SheetContent, SpecLimit } = db();
  const device = await Device.findOne({ where: { id: opts.deviceId, organizationId: opts.organizationId }, include: [Organization] });
  if (!device) throw new AppError("not-found", "No such device in your organization.");
  const organization = (device as Device & { Organization?: Organization }).Organization!;
  const [sets, limits, content, conformityAlerts] = await Promise.all([
    MeasurementSet.unscoped().findAll({
      where: { deviceId: device.id, organizationId: opts.organizationId, state: "approved", supersededById: { [Op.is]: null } },
      attributes: ["id", "kind", "conditions", "measuredOn", "parameters", "curves", "warnings"],
      include: [{ model: Instrument, through: { attributes: [] } }],
      order: [["id", "ASC"]],
    }),
    SpecLimit.findAll({ where: { deviceId: device.id, organizationId: opts.organizationId }, order: [["id", "ASC"]] }),
    SheetContent.findOne({ where: { deviceId: device.id, organizationId: opts.organizationId } }),
    openConformityIssues({ organizationId: opts.organizationId, deviceId: device.id }),
  ]);
  const designData = await loadDesignData(content, opts.organizationId);
  return {
    device: {
      partNumber: device.partNumber,
      deviceClass: device.deviceClass,
      title: device.title,
      description: device.description,
      keyConditions: device.keyConditions,
      organizationName: organization.name,
    },
    revision: { ...(opts.revision ?? { label: null, state: "draft", history: [] }), date: opts.date },
    approvedSets: (sets as SetWithInstruments[]).map((s) => ({
      id: s.id,
      kind: s.kind,
      serial: s.conditions.serial,
      lot: s.conditions.lot,
      temperatureC: s.conditions.temperatureC,
      measuredOn: s.measuredOn ?? opts.date,
      parameters: s.parameters,
      curves: (s.curves ?? []) as Curve[],
      plausibilityWarnings: (s.warnings ?? []).filter(isPlausibilityWarning),
      instruments: (s.Instruments ?? []).map((i) => ({
        kind: i.kind,
        model: i.model,
        serial: i.serial,
        calibratedOn: i.calibratedOn,
        calibrationDueOn: i.calibrationDueOn,
        uncertainty: i.uncertainty,
      })),
    })),
    limits: limits.map((l) => ({
      parameter: l.parameter,
      conditionsKey: l.conditionsKey,
      ...(l.minValue !== null ? { min: l.minValue } : {}),
      ...(l.typValue !== null ? { typ: l.typValue } : {}),
      ...(l.maxValue !== null ? { max: l.maxValue } : {}),
      unit: l.unit,
      basis: l.basis,
      ...(l.footnote ? { footnote: l.footnote } : {}),
      ...typedDecimalsOf(l),
    })),
    prose: content?.prose ?? {},
    absoluteMaximumRatings: content?.absoluteMaximumRatings ?? [],
    ...(designData ? { designData } : {}),
    ...(conformityAlerts.length ? { conformityAlerts } : {}),
    settings: {
      cpkThreshold: organization.cpkThreshold,
      cpkMinUnits: organization.cpkMinUnits,
      limitMinUnits: organization.limitMinUnits,
      toleranceCoverage: organization.toleranceCoverage,
      toleranceConfidence: organization.toleranceConfidence,
      measurementUncertainty: content?.measurementUncertainty ?? {},
    },
  };
}

/** The decimals each figure of a limit was typed with, where known. */
function typedDecimalsOf(l: SpecLimit): Pick<SheetInput["limits"][number], "decimals"> {
  const decimals = {
    ...(l.minDecimals != null ? { min: l.minDecimals } : {}),
    ...(l.typDecimals != null ? { typ: l.typDecimals } : {}),
    ...(l.maxDecimals != null ? { max: l.maxDecimals } : {}),
  };
  return Object.keys(decimals).length ? { decimals } : {};
}
