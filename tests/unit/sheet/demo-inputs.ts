import { analyzeWithSettings } from "@/lib/analysis";
import { parsedInStatedBand } from "@/lib/analysis/touchstone-band";
import { uploadAnalysisSettings } from "@/lib/ingest/upload-conditions";
import { findSheetTemplate } from "@/templates";
import { parseMeasurementFile } from "@/lib/ingest";
import { mergeUploadConditions, stampStatedConditions, uploadMeasuredOn } from "@/lib/ingest/upload-conditions";
import { uploadFieldsSchema } from "@/lib/schemas/measurements";
import type { ApprovedSetInput, SheetInput } from "@/lib/sheet";
import { demoConformityUnits } from "@/models/seeders/demo-conformity";
import { demoInstruments, demoUploads } from "@/models/seeders/demo-measurements";
import { demoOrganizations } from "@/models/seeders/demo-scenario";
import { demoSheets } from "@/models/seeders/demo-sheets";
import { demoDesignIn, demoOutlineBytes } from "@/models/seeders/demo-design-in";
import { outlinePng } from "@/lib/server/sheets/outline-png";
import { createHash } from "node:crypto";
import type { DesignDataInput } from "@/lib/sheet/types";

/**
 * The sheet input each demo device gets on a fresh database, built without one: the demo files
 * go through the same parser, condition merge and derivation as an upload, set ids follow the
 * upload order (as auto-increment ids do on a fresh database), and the demo sheet content is
 * what the demo loader saves. Organization settings are the defaults of the organizations table.
 * Conformity alerts live only in the database: the open one the demo raises on KDX-2G4 is not in
 * these inputs (tests/integration/sheets.test.ts leaves it out of the comparison and checks it apart).
 * The design-in data is what the loader saves, the outline rasterised as the upload endpoint does it
 * (a test importing this needs `vi.mock("server-only", () => ({}))`).
 */
export function demoSheetInputs(date: string): { partNumber: string; input: SheetInput }[] {
  const setsByPart = new Map<string, ApprovedSetInput[]>();
  // The conformity watch's units come after every other upload (scripts/seed-demo-conformity.ts).
  [...demoUploads, ...demoConformityUnits].forEach((upload, index) => {
    const fields = uploadFieldsSchema.parse(upload.fields);
    const parsed = parseMeasurementFile({ fileName: upload.file, bytes: new Uint8Array(upload.bytes()) });
    const conditions = mergeUploadConditions(parsed, fields, []);
    // The settings an upload resolves: the file's lines, the upload's fields, then the device class's defaults.
    const deviceClass = demoOrganizations.find((o) => o.slug === upload.org)!.devices.find((d) => d.partNumber === upload.part)!.deviceClass;
    const inBand = parsedInStatedBand(parsed, fields);
    if ("problem" in inBand) throw new Error(`${upload.file}: ${inBand.problem}`);
    const template = findSheetTemplate(deviceClass);
    const analyzed = analyzeWithSettings(inBand.parsed, { upload: uploadAnalysisSettings(fields), template: template?.analysisDefaults }, template?.deriveOptions);
    const derived = JSON.parse(JSON.stringify(analyzed)) as typeof analyzed;
    if (!upload.approve) return;
    const instruments = upload.instruments.map((key) => demoInstruments[upload.org].find((i) => i.key === key)!);
    const sets = setsByPart.get(upload.part) ?? [];
    sets.push({
      id: index + 1,
      kind: parsed.kind,
      serial: conditions.serial,
      lot: conditions.lot,
      temperatureC: conditions.temperatureC,
      measuredOn: uploadMeasuredOn(parsed, fields) ?? date,
      parameters: stampStatedConditions(derived.parameters, conditions),
      curves: derived.curves,
      instruments: instruments.map(({ kind, model, serial, calibratedOn, calibrationDueOn, uncertainty }) => ({ kind, model, serial, calibratedOn, calibrationDueOn, uncertainty })),
    });
    setsByPart.set(upload.part, sets);
  });
  return demoOrganizations.flatMap((org) =>
    org.devices.map((device) => {
      const content = demoSheets[device.partNumber];
      return {
        partNumber: device.partNumber,
        input: {
          device: { ...device, organizationName: org.name },
          revision: { label: null, state: "draft", date, history: [] },
          approvedSets: setsByPart.get(device.partNumber) ?? [],
          limits: content?.limits ?? [],
          prose: content?.prose ?? {},
          absoluteMaximumRatings: content?.absoluteMaximumRatings ?? [],
          ...(demoDesignIn[device.partNumber] ? { designData: demoDesignData(device.partNumber) } : {}),
          settings: { cpkThreshold: 1.33, toleranceCoverage: 0.99, toleranceConfidence: 0.95, measurementUncertainty: content?.measurementUncertainty ?? {} },
        },
      };
    }),
  );
}

/** The design-in data the demo loader saves for a part, the outline as the server stores it. */
function demoDesignData(part: string): DesignDataInput {
  const { packageOutline, pinFunctions, ordering, recommendedOperatingConditions } = demoDesignIn[part];
  const { png, widthPx, heightPx } = outlinePng({ name: packageOutline.file, bytes: demoOutlineBytes(packageOutline.file) });
  return {
    pinFunctions,
    ordering,
    recommendedOperatingConditions,
    packageOutline: { caption: packageOutline.caption, sha256: createHash("sha256").update(png).digest("hex"), widthPx, heightPx, pngBase64: png.toString("base64") },
    packageOutlineCaption: packageOutline.caption,
  };
}
