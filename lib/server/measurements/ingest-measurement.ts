import "server-only";
import { createHash } from "node:crypto";
import { UniqueConstraintError } from "sequelize";
import { analyzeWithSettings, isAnalysisSettingError } from "@/lib/analysis";
import { parsedInStatedBand } from "@/lib/analysis/touchstone-band";
import { findSheetTemplate, ingestOptionsFor } from "@/templates";
import { AppError } from "@/lib/errors";
import { isIngestError, parseMeasurementFile, type ParsedMeasurement } from "@/lib/ingest";
import { mappingTargets, parseMappedFile, readForeignTable, type MappableKind } from "@/lib/ingest/column-mapping";
import { deviceClassLabels, isDeviceClass } from "@/lib/domain/device-classes";
import { uploadConditionFields } from "@/templates/upload-conditions";
import { checkClassConditions, mergeUploadConditions, stampStatedConditions, uploadAnalysisSettings, uploadMeasuredOn } from "@/lib/ingest/upload-conditions";
import type { UploadFields } from "@/lib/schemas/measurements";
import { db } from "@/models";
import type { ColumnMapping, MeasurementSet, StoredFile } from "@/models";
import { headerSignature } from "../column-mappings/save-column-mapping";
import { recordAuditEvent } from "../audit/record-audit-event";
import { loadMeasurementSets } from "./load-measurement-sets";
import type { MeasurementSetSummary } from "./measurement-set-summary";
import { maxUploadBytes, type UploadedFile } from "./read-upload-form";
import { toPlainJson } from "./to-plain-json";
import { refreshOpenCandidates } from "../reviews/freshness";
import { storeFile } from "../storage/store-file";

export type UploadActor = { kind: "user"; userId: number } | { kind: "bench-token"; tokenId: number };

type IngestInput = {
  organizationId: number;
  deviceId: number;
  file: UploadedFile;
  fields: UploadFields;
  actor: UploadActor;
};

const FOREIGN_HEADER_CODES = new Set(["unknown-kind", "missing-column", "missing-unit", "unknown-unit", "duplicate-column", "missing-header"]);

function rejectIngest(error: unknown, extra: Record<string, unknown> = {}): never {
  if (isIngestError(error)) {
    throw new AppError(error.code === "too-large" ? "payload-too-large" : "invalid", error.message, { ingest: error.toJSON(), ...extra });
  }
  throw error;
}

/** `# key: value` lines a mapped file may lack, from what the engineer stated at upload. */
function metadataFromFields(kind: MappableKind, fields: UploadFields): Record<string, string> {
  const m: Record<string, string> = {};
  if (fields.serial) m.serial = fields.serial;
  if (fields.lot) m.lot = fields.lot;
  if (fields.temperatureC !== undefined) m.temperature = `${fields.temperatureC} C`;
  if (fields.inputFrequencyHz !== undefined) m[kind === "phase-noise" ? "carrier_frequency" : "input_frequency"] = `${fields.inputFrequencyHz} Hz`;
  if (fields.splitterExcessLossDb !== undefined) m.splitter_excess_loss = `${fields.splitterExcessLossDb} dB`;
  if (fields.cableLossDb !== undefined) m.cable_loss = `${fields.cableLossDb} dB`;
  if (fields.loDriveDbm !== undefined && (kind === "frequency-sweep" || kind === "two-tone")) m.lo_power = `${fields.loDriveDbm} dBm`;
  if (fields.loFrequencyHz !== undefined && kind === "frequency-sweep") m.lo_frequency = `${fields.loFrequencyHz} Hz`;
  if (fields.ifFrequencyHz !== undefined && kind === "frequency-sweep") m.if_frequency = `${fields.ifFrequencyHz} Hz`;
  return m;
}

async function parseWithMapping(opts: { organizationId: number; file: UploadedFile; fields: UploadFields; mapping: ColumnMapping; passive: boolean }): Promise<ParsedMeasurement> {
  const { file, fields, mapping, passive } = opts;
  const kind = mapping.kind as MappableKind;
  try {
    return parseMappedFile({
      fileName: file.name,
      bytes: file.bytes,
      kind,
      mapping: mapping.mapping.entries,
      metadata: { ...mapping.mapping.metadata, ...metadataFromFields(kind, fields) },
      maxBytes: maxUploadBytes(),
      passive,
    });
  } catch (error) {
    rejectIngest(error, { mappingName: mapping.name });
  }
}

/**
 * The engine's parse, or a saved column mapping for a foreign CSV (chosen, or found by its
 * header row). A foreign file without a mapping gets a 422 carrying its headers and a preview,
 * so the upload form can open the mapping step. Errors name file, line, column and field.
 */
export async function parseUpload(opts: { organizationId: number; file: UploadedFile; fields: UploadFields; deviceClass: string }): Promise<ParsedMeasurement> {
  const { ColumnMapping } = db();
  const { organizationId, file, fields } = opts;
  // The device's class says whether its files are held to a passive part's bounds (templates/*: passive).
  const { passive } = ingestOptionsFor(findSheetTemplate(opts.deviceClass));
  if (fields.mappingId) {
    const mapping = await ColumnMapping.findOne({ where: { id: fields.mappingId, organizationId } });
    if (!mapping) throw new AppError("invalid", "No such column mapping in your organization.", { field: "mappingId" });
    return parseWithMapping({ organizationId, file, fields, mapping, passive });
  }
  try {
    return parseMeasurementFile({ fileName: file.name, bytes: file.bytes, kind: fields.kind, maxBytes: maxUploadBytes(), passive });
  } catch (error) {
    if (!isIngestError(error) || !FOREIGN_HEADER_CODES.has(error.code) || /\.(s\d+p|ts)$/i.test(file.name)) rejectIngest(error);
    let table: ReturnType<typeof readForeignTable>;
    try {
      table = readForeignTable(file.name, file.bytes);
    } catch {
      rejectIngest(error);
    }
    if (error.line !== undefined && error.line !== table.headerLine) rejectIngest(error);
    const saved = await ColumnMapping.findOne({ where: { organizationId, headerSignature: headerSignature(table.headers) } });
    if (saved) return parseWithMapping({ organizationId, file, fields, mapping: saved, passive });
    rejectIngest(error, { mapping: { headers: table.headers, preview: table.preview, headerLine: table.headerLine, targets: mappingTargets } });
  }
}

/**
 * The engine with the settings in force: the file's own lines, then the upload's fields, then the
 * device class's defaults (lib/analysis/analyze-with-settings.ts, the CLI's path too). A setting the
 * data cannot honour (a band outside the trace) is a 422 naming it and the data's span.
 */
function deriveWithSettings(input: { parsed: ParsedMeasurement; fields: UploadFields; deviceClass: string; fileName: string }) {
  const upload = uploadAnalysisSettings(input.fields);
  const parsed = inStatedBand(input.parsed, input.fields, input.fileName);
  try {
    const template = findSheetTemplate(input.deviceClass);
    return analyzeWithSettings(parsed, { upload, template: template?.analysisDefaults }, template?.deriveOptions);
  } catch (error) {
    if (isAnalysisSettingError(error)) throw new AppError("invalid", `${input.fileName}: ${error.message}.`, { field: error.field });
    throw error;
  }
}

/** A network measured over more than the band the upload states is derived over that band (a hybrid's band condition). */
function inStatedBand(parsed: ParsedMeasurement, fields: UploadFields, fileName: string): ParsedMeasurement {
  const result = parsedInStatedBand(parsed, fields);
  if ("problem" in result) throw new AppError("invalid", `${fileName}: ${result.problem}.`, { field: result.field });
  return result.parsed;
}

/**
 * Parse → derive → store, in one transaction: the raw bytes (to the file store) with their SHA-256, the parsed
 * data, the derived parameters and the audit event. A bad file leaves nothing behind.
 * Shared by the browser upload and the bench API.
 */
export async function ingestMeasurement(input: IngestInput): Promise<MeasurementSetSummary> {
  const { Device, Instrument, MeasurementSet, MeasurementSetInstrument, StoredFile, sequelize } = db();
  const { organizationId, deviceId, file, fields, actor } = input;
  const device = await Device.findOne({ where: { id: deviceId, organizationId } });
  if (!device) throw new AppError("not-found", "No such device in your organization.");
  if (isDeviceClass(device.deviceClass)) {
    checkClassConditions({ classLabel: deviceClassLabels[device.deviceClass], allowed: uploadConditionFields(device.deviceClass), fields });
  }

  const parsed = await parseUpload({ organizationId, file, fields, deviceClass: device.deviceClass });
  const warnings = [...parsed.warnings];
  const conditions = mergeUploadConditions(parsed, fields, warnings);
  const derived = deriveWithSettings({ parsed, fields, deviceClass: device.deviceClass, fileName: file.name });
  // The impedance of power readings, when the file or the upload stated one: the set's tables use it (tabulateStoredSet).
  if (parsed.kind !== "touchstone" && derived.settings.impedance.source !== "engine") conditions.impedanceOhm = derived.settings.impedance.value;
  // derived.warnings repeats the parser's own (deriveParameters begins with them): store each once.
  const fromParser = new Set(parsed.warnings);
  warnings.push(...derived.warnings.filter((w) => !fromParser.has(w)));
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  const measuredOn = uploadMeasuredOn(parsed, fields) ?? new Date().toISOString().slice(0, 10);

  try {
    const id = await sequelize.transaction(async (transaction) => {
      // Lock the device row so two uploads of the same bytes cannot both pass the duplicate check.
      await Device.findOne({ where: { id: deviceId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
      const earlier = await MeasurementSet.findOne({ where: { deviceId, sha256 }, include: [{ model: StoredFile, attributes: ["originalName"] }], transaction });
      if (earlier) {
        const name = (earlier as MeasurementSet & { StoredFile?: StoredFile }).StoredFile?.originalName ?? "a file";
        throw new AppError("conflict", `This file is identical (same SHA-256) to measurement set #${earlier.id} (${name}), uploaded ${earlier.createdAt.toISOString().slice(0, 10)}.`, {
          existingSetId: earlier.id,
        });
      }
      const instruments = fields.instrumentIds.length
        ? await Instrument.findAll({ where: { id: fields.instrumentIds, organizationId }, transaction })
        : [];
      if (instruments.length !== new Set(fields.instrumentIds).size) {
        throw new AppError("invalid", "One of the chosen instruments is not in your organization's list.", { field: "instrumentIds" });
      }
      const lapsed = new Map<number, boolean>();
      for (const instrument of instruments) {
        const isLapsed = measuredOn > instrument.calibrationDueOn || measuredOn < instrument.calibratedOn;
        lapsed.set(instrument.id, isLapsed);
        if (isLapsed) {
          warnings.push(`Calibration of ${instrument.kind} ${instrument.model} (serial ${instrument.serial}) was not valid on ${measuredOn}: calibrated ${instrument.calibratedOn}, due ${instrument.calibrationDueOn}.`);
        }
      }
      let superseded: MeasurementSet | null = null;
      if (fields.supersedesId) {
        superseded = await MeasurementSet.findOne({ where: { id: fields.supersedesId, deviceId, organizationId }, lock: transaction.LOCK.UPDATE, transaction });
        if (!superseded) throw new AppError("invalid", `Measurement set #${fields.supersedesId} is not on this device.`, { field: "supersedesId" });
        if (superseded.supersededById) throw new AppError("conflict", `Measurement set #${superseded.id} is already superseded by #${superseded.supersededById}.`);
      }
      // The bytes go to the file store last of the checks, inside the transaction: a store that
      // refuses them throws a 503 and the transaction rolls back, so the upload leaves nothing.
      const stored = await storeFile({ organizationId, bytes: file.bytes, sha256, originalName: file.name, contentType: file.contentType }, transaction);
      const set = await MeasurementSet.create(
        {
          organizationId,
          deviceId,
          storedFileId: stored.id,
          sha256,
          kind: parsed.kind,
          state: "submitted",
          supersedesId: superseded?.id ?? null,
          conditions,
          parsed: toPlainJson(parsed.data),
          parameters: stampStatedConditions(derived.parameters, conditions),
          curves: toPlainJson(derived.curves),
          warnings,
          measuredOn,
          source: actor.kind === "user" ? "browser" : "bench-api",
          uploadedById: actor.kind === "user" ? actor.userId : null,
          benchTokenId: actor.kind === "bench-token" ? actor.tokenId : null,
        },
        { transaction },
      );
      if (instruments.length) {
        await MeasurementSetInstrument.bulkCreate(
          instruments.map((i) => ({ measurementSetId: set.id, instrumentId: i.id, calibrationLapsed: lapsed.get(i.id)! })),
          { transaction },
        );
      }
      if (superseded) {
        superseded.supersededById = set.id;
        await superseded.save({ transaction });
      }
      await recordAuditEvent(
        {
          organizationId,
          actorUserId: actor.kind === "user" ? actor.userId : null,
          action: "measurement-set.upload",
          subjectType: "measurement-set",
          subjectId: set.id,
          after: { deviceId, kind: parsed.kind, file: file.name, sha256, state: "submitted", supersedesId: superseded?.id ?? null, via: actor.kind === "user" ? "browser" : `bench-token:${actor.tokenId}` },
        },
        transaction,
      );
      return set.id;
    });
    if (fields.supersedesId) await refreshOpenCandidates({ organizationId, deviceId });
    const [summary] = await loadMeasurementSets({ id, organizationId });
    return summary;
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new AppError("conflict", "This file is identical (same SHA-256) to a set already on this device.");
    throw error;
  }
}
