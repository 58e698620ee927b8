import { deviceClassLabels } from "../domain/device-classes";
import { limitBases, limitBasisWords, revisionStateLabels } from "../domain/sheets";
import { findSheetTemplate } from "../../templates";
import type { ClassConditions, SheetTemplate } from "../../templates/types";
import { keyConditionField } from "../domain/measurement-conditions";
import { compareSets, compareStrings } from "./compare";
import { formatNumber, formatQuantity, quantityParts, rangeParts } from "../format/quantity";
import { renderProse } from "./render-prose";
import { buildDesignData } from "./design-data";
import { buildCharts } from "./sheet-charts";
import { buildSpecTable, type SpecTable } from "./spec-table";
import { DEFAULT_CPK_MIN_UNITS } from "./statistics";
import { buildTraceability } from "./traceability";
import {
  checkLimitSpread,
  checkLimitUnitCount,
  checkStatedBands,
  checkStatedUncertainty,
  checkSpurBandwidth,
  DEFAULT_LIMIT_MIN_UNITS,
  ratedOperatingTemperature,
  reviewCheckStatements,
} from "./consistency-checks";
import type { ApprovedSetInput, SheetInput, SheetModel } from "./types";
import { PLAUSIBILITY_PREFIX } from "../ingest/plausibility-warning";

export const PRELIMINARY_BANNER = "PRELIMINARY — NOT RELEASED";

const BASIS_LEGEND = limitBases.map((basis) => ({ basis, mark: limitBasisWords[basis].mark, text: limitBasisWords[basis].legend }));

const NO_DATA_NOTICE =
  "No measurement set of this device has been approved yet. The electrical specifications, the charts, the traceability and the statistics fill in once a reviewer approves measurements.";

type Issues = SheetModel["issues"];

export interface BuildSheetModelOptions {
  /** Use this template instead of the registry's for the device class. */
  template?: SheetTemplate;
}

/**
 * Everything a characterization sheet shows, computed once from the device
 * data. Deterministic: the same input in any array order gives the same model
 * (serializeSheetModel makes it byte-identical JSON).
 */
export function buildSheetModel(input: SheetInput, options: BuildSheetModelOptions = {}): SheetModel {
  const template = options.template ?? findSheetTemplate(input.device.deviceClass, input.device.keyConditions);
  if (!template) throw new RangeError(`No sheet template for device class "${input.device.deviceClass}"`);
  if (!/^\d{4}-\d{2}-\d{2}$/.test(input.revision.date)) {
    throw new RangeError(`Revision date must be an ISO date (YYYY-MM-DD), got "${input.revision.date}"`);
  }
  const classLabel = deviceClassLabels[template.deviceClass];
  // Issues are listed in the order the sections below raise them.
  const issues: Issues = [];
  const sets = selectSets(template, input.approvedSets, classLabel, issues);
  const specTable = buildSpecTable({ template, sets, limits: input.limits, settings: input.settings, classLabel });
  issues.push(...specTable.issues);
  const header = buildHeader(input, classLabel, issues);
  const absoluteMaximumRatings = buildAbsoluteMaximumRatings(template, input.absoluteMaximumRatings, issues);
  const traceability = buildTraceability(sets, issues);
  const charts = buildCharts(template, sets);
  const prose = buildProse(template, input, issues);
  issues.push(...consistencyIssues(template, input, sets, specTable));
  // Units approved after the release that the released limits or the control charts disagree with.
  for (const message of input.conformityAlerts ?? []) issues.push({ code: "conformity-alert", message });

  return {
    schemaVersion: 1,
    template: { deviceClass: template.deviceClass, label: classLabel, ...(template.statedDriveDbm === undefined ? {} : { statedDriveDbm: template.statedDriveDbm }) },
    header,
    keyFacts: buildKeyFacts(input.device.keyConditions, template.conditions),
    noDataNotice: sets.length === 0 ? NO_DATA_NOTICE : null,
    specifications: {
      ...withoutEmptyConditionColumns(template, specTable.rows),
      notes: notesForRows(template, specTable.rows),
      basisLegend: BASIS_LEGEND.map((entry) => ({ ...entry })),
      footnotes: specTable.footnotes,
    },
    absoluteMaximumRatings,
    designData: buildDesignData(input.designData),
    charts,
    prose,
    cautions: [...template.cautions],
    traceability,
    statistics: buildStatisticsSection(input.settings, specTable),
    revisionHistory: [...input.revision.history]
      .sort((a, b) => compareStrings(a.date, b.date) || compareStrings(a.label, b.label))
      .map(({ label, date, summary }) => ({ label, date, summary })),
    release: null,
    issues,
    reviewChecks: [...reviewCheckStatements],
  };
}

/** The consistency checks before review (lib/sheet/consistency-checks.ts), in the order the sheet reads. */
function consistencyIssues(template: SheetTemplate, input: SheetInput, sets: ApprovedSetInput[], specTable: SpecTable): Issues {
  return [
    ...checkStatedBands({ template, keyConditions: input.device.keyConditions, groups: specTable.groups }),
    ...checkStatedUncertainty({ rows: template.specifications.rows, sets, measurementUncertainty: input.settings.measurementUncertainty }),
    ...checkLimitSpread({ groups: specTable.groups, operatingTemperatureC: ratedOperatingTemperature(input.absoluteMaximumRatings) }),
    ...checkLimitUnitCount({ groups: specTable.groups, minUnits: input.settings.limitMinUnits ?? DEFAULT_LIMIT_MIN_UNITS }),
    ...checkSpurBandwidth({ rows: template.specifications.rows, sets }),
  ];
}

/** The approved sets of the kinds the template takes, in a fixed order; any other set, or none, is an issue. */
function selectSets(template: SheetTemplate, approvedSets: ApprovedSetInput[], classLabel: string, issues: Issues): ApprovedSetInput[] {
  const kinds = new Set<string>(template.measurementKinds);
  const allSets = [...approvedSets].sort(compareSets);
  for (const set of allSets) {
    if (!kinds.has(set.kind)) {
      issues.push({
        code: "set-kind-not-used",
        message: `Measurement set ${String(set.id)} (${set.kind}, ${set.serial}) is not used: a ${classLabel.toLowerCase()} sheet takes ${template.measurementKinds.join(", ")}.`,
      });
    }
  }
  const sets = allSets.filter((set) => kinds.has(set.kind));
  for (const set of sets) {
    for (const warning of set.plausibilityWarnings ?? []) {
      issues.push({
        code: "implausible-value",
        message: `Measurement set ${String(set.id)} (${set.kind}, ${set.serial}) carries a plausibility warning: ${warning.slice(PLAUSIBILITY_PREFIX.length)}.`,
      });
    }
  }
  if (sets.length === 0) {
    issues.push({
      code: "no-approved-data",
      message: `No approved ${template.measurementKinds.join(" or ")} measurement set feeds this sheet: it has no specifications, charts or statistics yet.`,
    });
  }
  return sets;
}

function buildHeader(input: SheetInput, classLabel: string, issues: Issues): SheetModel["header"] {
  const revisionLabel = input.revision.label;
  const released = input.revision.state === "released" && revisionLabel !== null;
  if (input.revision.state === "released" && revisionLabel === null) {
    issues.push({ code: "release-without-label", message: "The revision is marked released but has no revision letter." });
  }
  return {
    partNumber: input.device.partNumber,
    title: input.device.title,
    organizationName: input.device.organizationName,
    deviceClassLabel: classLabel,
    description: input.device.description,
    revisionText: revisionLabel ? `Rev. ${revisionLabel}` : "Unreleased",
    revisionLabel,
    state: input.revision.state,
    stateLabel: revisionStateLabels[input.revision.state],
    date: input.revision.date,
    released,
    banner: released ? null : PRELIMINARY_BANNER,
  };
}

/** Each prose section: the sheet's own text, else the device description (for "description"), else the template's. */
function buildProse(template: SheetTemplate, input: SheetInput, issues: Issues): SheetModel["prose"] {
  return template.prose.map((section) => {
    const own = input.prose[section.id];
    const fromDevice = section.id === "description" && input.device.description.trim() ? input.device.description : undefined;
    const markdown = own?.trim() ? own : (fromDevice ?? section.markdown);
    const rendered = renderProse(markdown);
    if (rendered.breach) {
      issues.push({ code: "prose-over-limit", message: `The section “${section.title}” is not shown: it ${rendered.breach.reason}.` });
    }
    return { id: section.id, title: section.title, html: rendered.html, blocks: rendered.blocks, isDefault: !own?.trim() && !fromDevice };
  });
}

function buildStatisticsSection(settings: SheetInput["settings"], specTable: SpecTable): SheetModel["statistics"] {
  return {
    coverage: settings.toleranceCoverage,
    confidence: settings.toleranceConfidence,
    cpkThreshold: settings.cpkThreshold,
    cpkMinUnits: settings.cpkMinUnits ?? DEFAULT_CPK_MIN_UNITS,
    method:
      `Per parameter and condition group across units: n, mean, sample standard deviation s (n − 1), median, min, max. ` +
      `Proposed limits are the two-sided normal tolerance interval mean ± k·s covering ${formatQuantity(settings.toleranceCoverage * 100, "%", { digits: { maxDecimals: 2 } })} ` +
      `of units with ${formatQuantity(settings.toleranceConfidence * 100, "%", { digits: { maxDecimals: 2 } })} confidence, exact factor k ` +
      `(NIST/SEMATECH e-Handbook of Statistical Methods §7.2.6.3; Odeh & Owen 1980). ` +
      `Cpk = min[(USL − mean)/(3s), (mean − LSL)/(3s)] (NIST/SEMATECH §6.1.6). A limit is flagged as not supported by the data ` +
      `when Cpk < ${formatNumber(settings.cpkThreshold, { digits: { maxDecimals: 2 } })} or when any unit falls outside the guard-banded limit. ` +
      `Cpk is printed only from ${settings.cpkMinUnits ?? DEFAULT_CPK_MIN_UNITS} units or more (the organization's setting): from fewer its estimate is too uncertain to mean something, ` +
      `though it is still judged against the threshold. A printed Cpk carries its two-sided ` +
      `${formatQuantity(settings.toleranceConfidence * 100, "%", { digits: { maxDecimals: 2 } })} confidence interval ` +
      `Ĉpk ± z·√(1/(9n) + Ĉpk²/(2(n − 1))) (Bissell 1990, normal approximation).`,
    decisionRules: specTable.decisionRules,
    groups: specTable.groups,
    flaggedGroupCount: specTable.groups.filter((g) => !g.supported).length,
  };
}

function buildAbsoluteMaximumRatings(
  template: SheetTemplate,
  given: SheetInput["absoluteMaximumRatings"],
  issues: SheetModel["issues"],
): SheetModel["absoluteMaximumRatings"] {
  const normalize = (label: string) => label.trim().toLowerCase();
  const byLabel = new Map(given.map((rating) => [normalize(rating.label), rating]));
  const rows: SheetModel["absoluteMaximumRatings"] = [];
  const used = new Set<string>();
  for (const placeholder of template.absoluteMaximumRatings) {
    const key = normalize(placeholder.label);
    const rating = byLabel.get(key);
    used.add(key);
    if (rating && rating.value.trim()) {
      rows.push({ label: placeholder.label, value: rating.value.trim(), unit: rating.unit || placeholder.unit, missing: false });
    } else {
      rows.push({ label: placeholder.label, value: "", unit: placeholder.unit, missing: true });
      issues.push({ code: "rating-missing", message: `Absolute maximum rating "${placeholder.label}" has no value: it comes from the device data.` });
    }
  }
  for (const rating of given) {
    if (used.has(normalize(rating.label)) || !rating.value.trim()) continue;
    used.add(normalize(rating.label));
    rows.push({ label: rating.label.trim(), value: rating.value.trim(), unit: rating.unit, missing: false });
  }
  return rows;
}

/** The device's key conditions, each named by the class's condition words ("Drive level, per port", "LO drive", "Band"). */
function buildKeyFacts(conditions: SheetInput["device"]["keyConditions"], words: ClassConditions): SheetModel["keyFacts"] {
  const facts: SheetModel["keyFacts"] = [];
  const range = (label: string, r: { min: number; max: number } | undefined) => {
    if (!r) return;
    facts.push({ label, ...rangeParts(r.min, r.max, "Hz") });
  };
  range(keyConditionField(words, "inputFrequency").label, conditions.inputFrequencyHz);
  range("Output frequency", conditions.outputFrequencyHz);
  if (conditions.driveLevelDbm !== undefined) {
    facts.push({ label: keyConditionField(words, "drive").label, ...quantityParts(conditions.driveLevelDbm, "dBm", { signed: true, digits: { maxDecimals: 1 } }) });
  }
  if (conditions.multiplicationFactor !== undefined) {
    facts.push({ label: "Multiplication factor", value: `×${formatNumber(conditions.multiplicationFactor, { digits: { maxDecimals: 0 } })}`, unit: "" });
  }
  return facts;
}

/** The template's notes under the table: each note about some rows only where one of those rows is on the sheet. */
function notesForRows(template: SheetTemplate, rows: SheetModel["specifications"]["rows"]): string[] {
  const present = new Set(rows.map((row) => row.rowId));
  return template.specifications.notes.flatMap((note) => (typeof note === "string" ? [note] : note.rows.some((id) => present.has(id)) ? [note.text] : []));
}

/**
 * The template's condition columns that some row fills, and each row's cells for those: a column no
 * row uses (the LO frequency of a mixer swept at a fixed IF, the offset of a doubler without phase
 * noise) would print an empty column across the table.
 */
function withoutEmptyConditionColumns(template: SheetTemplate, rows: SheetModel["specifications"]["rows"]) {
  const used = template.specifications.conditionColumns.map((_, i) => rows.some((row) => row.conditions[i] !== ""));
  return {
    conditionColumns: template.specifications.conditionColumns.filter((_, i) => used[i]).map(({ id, label }) => ({ id, label })),
    rows: rows.map((row) => ({ ...row, conditions: row.conditions.filter((_, i) => used[i]) })),
  };
}
