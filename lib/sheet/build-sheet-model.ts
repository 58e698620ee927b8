import { deviceClassLabels } from "../domain/device-classes";
import { limitBases, limitBasisWords, revisionStateLabels } from "../domain/sheets";
import { findSheetTemplate } from "../../templates";
import type { SheetTemplate, SpecRowTemplate, TrendTemplate } from "../../templates/types";
import { buildChartSpec, type ChartSource } from "./charts";
import { formatConditionCell, makeConditionsKey, parseConditionsKey, type Conditions } from "./conditions";
import { formatNumber, formatQuantity, formatRange, quantityParts, rangeParts } from "../format/quantity";
import { formatTemperature, formatValue } from "./format";
import { renderProse } from "./render-prose";
import { computeGroupStatistics, type UnitValue } from "./statistics";
import type {
  ApprovedSetInput,
  ChartSpec,
  SheetInput,
  SheetModel,
  SpecLimitInput,
  SpecTableRow,
  StatisticsGroup,
} from "./types";

export const PRELIMINARY_BANNER = "PRELIMINARY — NOT RELEASED";

const BASIS_LEGEND = limitBases.map((basis) => ({ basis, mark: limitBasisWords[basis].mark, text: limitBasisWords[basis].legend }));

const MEASURED_MEAN_FOOTNOTE =
  "No typical value is stated: the figure is the mean of the units measured (n in the statistics annex).";

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
  const template = options.template ?? findSheetTemplate(input.device.deviceClass);
  if (!template) throw new RangeError(`No sheet template for device class "${input.device.deviceClass}"`);
  const classLabel = deviceClassLabels[template.deviceClass];
  if (!/^\d{4}-\d{2}-\d{2}$/.test(input.revision.date)) {
    throw new RangeError(`Revision date must be an ISO date (YYYY-MM-DD), got "${input.revision.date}"`);
  }
  const issues: SheetModel["issues"] = [];
  const kinds = new Set<string>(template.measurementKinds);
  const allSets = [...input.approvedSets].sort(compareSets);
  const sets = allSets.filter((set) => kinds.has(set.kind));
  for (const set of allSets) {
    if (!kinds.has(set.kind)) {
      issues.push({
        code: "set-kind-not-used",
        message: `Measurement set ${String(set.id)} (${set.kind}, ${set.serial}) is not used: a ${classLabel.toLowerCase()} sheet takes ${template.measurementKinds.join(", ")}.`,
      });
    }
  }

  if (sets.length === 0) {
    issues.push({
      code: "no-approved-data",
      message: `No approved ${template.measurementKinds.join(" or ")} measurement set feeds this sheet: it has no specifications, charts or statistics yet.`,
    });
  }

  const { limits, duplicateIssues } = indexLimits(input.limits);
  issues.push(...duplicateIssues);
  const usedLimits = new Set<string>();
  const uncertainty = input.settings.measurementUncertainty ?? {};
  const settings = input.settings;

  const groups: StatisticsGroup[] = [];
  const rows: SpecTableRow[] = [];
  const footnotes: { mark: string; text: string }[] = [];
  const footnoteMark = (text: string): string => {
    const existing = footnotes.find((f) => f.text === text);
    if (existing) return existing.mark;
    const mark = String(footnotes.length + 1);
    footnotes.push({ mark, text });
    return mark;
  };
  const decisionRules = new Set<string>();

  for (const row of template.specifications.rows) {
    const collected = collectRowValues(row, sets);
    for (const [key, limit] of limits) {
      if (limit.parameter !== row.parameter || usedLimits.has(key)) continue;
      if (!collected.has(limit.conditionsKey) && limitFitsRow(row, limit)) collected.set(limit.conditionsKey, []);
    }
    const orderedKeys = [...collected.keys()].sort((a, b) => compareConditions(parseConditionsKey(a), parseConditionsKey(b), row.groupBy));
    for (const conditionsKey of orderedKeys) {
      const limitKey = `${row.parameter}|${conditionsKey}`;
      const limit = limits.get(limitKey);
      if (limit) usedLimits.add(limitKey);
      const conditions = parseConditionsKey(conditionsKey);
      const conditionCells = template.specifications.conditionColumns.map((column) => formatConditionCell(column, conditions));
      const conditionsText = template.specifications.conditionColumns
        .map((column, i) => (conditionCells[i] ? `${column.label} ${conditionCells[i]}` : ""))
        .filter(Boolean)
        .join(", ");
      const values = collected.get(conditionsKey) ?? [];
      const stats = computeGroupStatistics({
        label: row.label,
        unit: row.unit,
        decimals: row.decimals,
        values,
        limit,
        expandedUncertainty: uncertainty[row.parameter],
        cpkThreshold: settings.cpkThreshold,
        coverage: settings.toleranceCoverage,
        confidence: settings.toleranceConfidence,
      });
      if (stats.ruleStatement) decisionRules.add(stats.ruleStatement);
      const groupId = `${row.id}:${conditionsKey}`;
      const supported = stats.flags.length === 0;
      const basis = limit?.basis ?? row.defaultBasis;
      groups.push({
        groupId,
        rowId: row.id,
        parameter: row.parameter,
        conditionsKey,
        label: row.label,
        symbol: row.symbol,
        unit: row.unit,
        conditionsText,
        n: stats.n,
        lots: stats.lots,
        mean: stats.mean,
        standardDeviation: stats.standardDeviation,
        median: stats.median,
        min: stats.min,
        max: stats.max,
        toleranceInterval: stats.toleranceInterval,
        limits: limit
          ? {
              min: formatValue(limit.min, row.decimals),
              typ: formatValue(limit.typ, row.decimals),
              max: formatValue(limit.max, row.decimals),
              basis,
            }
          : null,
        cpk: stats.cpk,
        expandedUncertainty: stats.expandedUncertainty,
        decisionRule: stats.decisionRule,
        acceptance: stats.acceptance,
        passCount: stats.passCount,
        failCount: stats.failCount,
        units: stats.units,
        flags: stats.flags,
        supported,
      });

      const typIsMeasuredMean = limit?.typ === undefined && stats.meanValue !== null;
      const marks: string[] = [];
      if (limit?.footnote) marks.push(footnoteMark(limit.footnote.trim()));
      if (typIsMeasuredMean) marks.push(footnoteMark(MEASURED_MEAN_FOOTNOTE));
      rows.push({
        groupId,
        rowId: row.id,
        parameter: row.parameter,
        conditionsKey,
        label: row.label,
        symbol: row.symbol,
        unit: row.unit,
        conditions: conditionCells,
        min: formatValue(limit?.min, row.decimals),
        typ: formatValue(limit?.typ ?? stats.meanValue, row.decimals),
        max: formatValue(limit?.max, row.decimals),
        typIsMeasuredMean,
        basis,
        basisMark: limitBasisWords[basis].mark,
        footnoteMarks: marks,
        n: stats.n,
        supported,
      });
    }
  }
  for (const [key, limit] of limits) {
    if (!usedLimits.has(key)) {
      issues.push({
        code: "limit-not-shown",
        message: `The limit for ${limit.parameter} at "${limit.conditionsKey}" matches no row of the ${classLabel.toLowerCase()} template.`,
      });
    }
  }

  const revisionLabel = input.revision.label;
  const released = input.revision.state === "released" && revisionLabel !== null;
  if (input.revision.state === "released" && revisionLabel === null) {
    issues.push({ code: "release-without-label", message: "The revision is marked released but has no revision letter." });
  }

  const absoluteMaximumRatings = buildAbsoluteMaximumRatings(template, input.absoluteMaximumRatings, issues);
  const traceability = buildTraceability(sets, issues);

  return {
    schemaVersion: 1,
    template: { deviceClass: template.deviceClass, label: classLabel },
    header: {
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
    },
    keyFacts: buildKeyFacts(input.device.keyConditions),
    noDataNotice:
      sets.length === 0
        ? "No measurement set of this device has been approved yet. The electrical specifications, the charts, the traceability and the statistics fill in once a reviewer approves measurements."
        : null,
    specifications: {
      conditionColumns: template.specifications.conditionColumns.map(({ id, label }) => ({ id, label })),
      rows,
      notes: [...template.specifications.notes],
      basisLegend: BASIS_LEGEND.map((entry) => ({ ...entry })),
      footnotes,
    },
    absoluteMaximumRatings,
    charts: buildCharts(template, sets),
    prose: template.prose.map((section) => {
      const own = input.prose[section.id];
      const fromDevice = section.id === "description" && input.device.description.trim() ? input.device.description : undefined;
      const markdown = own?.trim() ? own : (fromDevice ?? section.markdown);
      const rendered = renderProse(markdown);
      if (rendered.breach) {
        issues.push({ code: "prose-over-limit", message: `The section “${section.title}” is not shown: it ${rendered.breach.reason}.` });
      }
      return { id: section.id, title: section.title, html: rendered.html, blocks: rendered.blocks, isDefault: !own?.trim() && !fromDevice };
    }),
    cautions: [...template.cautions],
    traceability,
    statistics: {
      coverage: settings.toleranceCoverage,
      confidence: settings.toleranceConfidence,
      cpkThreshold: settings.cpkThreshold,
      method:
        `Per parameter and condition group across units: n, mean, sample standard deviation s (n − 1), median, min, max. ` +
        `Proposed limits are the two-sided normal tolerance interval mean ± k·s covering ${formatQuantity(settings.toleranceCoverage * 100, "%", { digits: { maxDecimals: 2 } })} ` +
        `of units with ${formatQuantity(settings.toleranceConfidence * 100, "%", { digits: { maxDecimals: 2 } })} confidence, exact factor k ` +
        `(NIST/SEMATECH e-Handbook of Statistical Methods §7.2.6.3; Odeh & Owen 1980). ` +
        `Cpk = min[(USL − mean)/(3s), (mean − LSL)/(3s)] (NIST/SEMATECH §6.1.6). A limit is flagged as not supported by the data ` +
        `when Cpk < ${formatNumber(settings.cpkThreshold, { digits: { maxDecimals: 2 } })} or when any unit falls outside the guard-banded limit.`,
      decisionRules: [...decisionRules].sort(),
      groups,
      flaggedGroupCount: groups.filter((g) => !g.supported).length,
    },
    revisionHistory: [...input.revision.history]
      .sort((a, b) => compareStrings(a.date, b.date) || compareStrings(a.label, b.label))
      .map(({ label, date, summary }) => ({ label, date, summary })),
    issues,
  };
}

function compareStrings(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

function compareSets(a: ApprovedSetInput, b: ApprovedSetInput): number {
  return (
    compareStrings(a.serial, b.serial) ||
    compareStrings(a.kind, b.kind) ||
    compareStrings(a.measuredOn, b.measuredOn) ||
    compareStrings(String(a.id), String(b.id))
  );
}

function compareValues(a: string | number | undefined, b: string | number | undefined): number {
  if (a === b) return 0;
  if (a === undefined) return -1;
  if (b === undefined) return 1;
  if (typeof a === "number" && typeof b === "number") return a - b;
  if (typeof a === "number") return -1;
  if (typeof b === "number") return 1;
  return compareStrings(a, b);
}

function compareConditions(a: Conditions, b: Conditions, order: string[]): number {
  for (const key of order) {
    const c = compareValues(a[key], b[key]);
    if (c !== 0) return c;
  }
  return compareStrings(makeConditionsKey(a), makeConditionsKey(b));
}

function indexLimits(input: SpecLimitInput[]) {
  const limits = new Map<string, SpecLimitInput>();
  const duplicateIssues: SheetModel["issues"] = [];
  const sorted = [...input].sort(
    (a, b) =>
      compareStrings(a.parameter, b.parameter) ||
      compareStrings(a.conditionsKey, b.conditionsKey) ||
      compareStrings(JSON.stringify(a), JSON.stringify(b)),
  );
  for (const limit of sorted) {
    const key = `${limit.parameter}|${limit.conditionsKey}`;
    if (limits.has(key)) {
      duplicateIssues.push({ code: "duplicate-limit", message: `Two limits for ${limit.parameter} at "${limit.conditionsKey}": the first in sort order is used.` });
      continue;
    }
    limits.set(key, limit);
  }
  return { limits, duplicateIssues };
}

function groupConditions(row: SpecRowTemplate, conditions: Conditions): Conditions | null {
  const match = row.match ?? {};
  for (const key of Object.keys(match)) if (conditions[key] !== match[key]) return null;
  const picked: Conditions = { ...match };
  for (const key of row.groupBy) if (conditions[key] !== undefined) picked[key] = conditions[key];
  return picked;
}

function limitFitsRow(row: SpecRowTemplate, limit: SpecLimitInput): boolean {
  const conditions = parseConditionsKey(limit.conditionsKey);
  const grouped = groupConditions(row, conditions);
  return grouped !== null && makeConditionsKey(grouped) === limit.conditionsKey;
}

interface Candidate extends UnitValue {
  measuredOn: string;
  tieBreak: string;
}

/** Values of one row by condition group, one per unit: the latest set wins when a unit was measured twice. */
function collectRowValues(row: SpecRowTemplate, sets: ApprovedSetInput[]): Map<string, UnitValue[]> {
  const byGroup = new Map<string, Map<string, Candidate>>();
  for (const set of sets) {
    const setId = String(set.id);
    for (const parameter of set.parameters) {
      if (parameter.name !== row.parameter || parameter.value === null || !Number.isFinite(parameter.value)) continue;
      const conditions: Conditions = { ...parameter.conditions };
      if (set.temperatureC !== undefined && conditions.temperatureC === undefined) conditions.temperatureC = set.temperatureC;
      const grouped = groupConditions(row, conditions);
      if (!grouped) continue;
      const key = makeConditionsKey(grouped);
      const candidate: Candidate = {
        serial: set.serial,
        lot: set.lot ?? null,
        setId,
        value: parameter.value,
        measuredOn: set.measuredOn,
        tieBreak: `${setId}|${makeConditionsKey(parameter.conditions)}|${parameter.value}`,
      };
      let units = byGroup.get(key);
      if (!units) byGroup.set(key, (units = new Map()));
      const current = units.get(set.serial);
      if (
        !current ||
        candidate.measuredOn > current.measuredOn ||
        (candidate.measuredOn === current.measuredOn && candidate.tieBreak > current.tieBreak)
      ) {
        units.set(set.serial, candidate);
      }
    }
  }
  const result = new Map<string, UnitValue[]>();
  for (const [key, units] of byGroup) {
    result.set(
      key,
      [...units.values()]
        .sort((a, b) => compareStrings(a.serial, b.serial))
        .map(({ serial, lot, setId, value }) => ({ serial, lot, setId, value })),
    );
  }
  return result;
}

/**
 * A chart draws one curve per unit under one set of conditions: the sets are grouped by
 * their frequency and temperature, and the group with the most units is drawn, named in
 * the caption. Among equals: the temperature nearest 25 °C, then the middle frequency
 * (the lower of two middles), so a band is shown at its centre rather than at an edge.
 */
function buildCharts(template: SheetTemplate, sets: ApprovedSetInput[]): SheetModel["charts"] {
  const charts: SheetModel["charts"] = [];
  for (const curveTemplate of template.curves) {
    const groups = new Map<string, { label: string; frequencyHz: number; temperatureC: number; sources: ChartSource[] }>();
    for (const set of sets) {
      for (const curve of set.curves) {
        if (curve.id !== curveTemplate.curveId) continue;
        const label = describeSetConditions(set);
        let group = groups.get(label);
        if (!group) groups.set(label, (group = { label, frequencyHz: setFrequencyHz(set), temperatureC: set.temperatureC ?? 25, sources: [] }));
        group.sources.push({ serial: set.serial, curve });
      }
    }
    const unitCount = (g: { sources: ChartSource[] }) => new Set(g.sources.map((s) => s.serial)).size;
    const most = Math.max(0, ...[...groups.values()].map(unitCount));
    const candidates = [...groups.values()].filter((g) => unitCount(g) === most);
    const nearestRoom = Math.min(...candidates.map((g) => Math.abs(g.temperatureC - 25)));
    const atRoom = candidates
      .filter((g) => Math.abs(g.temperatureC - 25) === nearestRoom)
      .sort((a, b) => a.frequencyHz - b.frequencyHz || compareStrings(a.label, b.label));
    const best = atRoom[Math.floor((atRoom.length - 1) / 2)];
    const chart = best ? buildChartSpec(curveTemplate, best.sources, { conditionsLabel: best.label }) : null;
    if (chart) charts.push(chart);
  }
  for (const trend of template.trends ?? []) {
    const chart = buildTrendChart(trend, sets);
    if (chart) charts.push(chart);
  }
  return charts;
}

/**
 * A trend chart: each unit's values of one parameter against one condition, at the
 * temperature with the most units. Drawn only when there are two or more x values.
 */
function buildTrendChart(trend: TrendTemplate, sets: ApprovedSetInput[]): ChartSpec | null {
  // temperature label → serial → x → value (the latest set wins, as in the statistics)
  const byTemperature = new Map<string, Map<string, Map<number, { value: number; order: string }>>>();
  for (const set of sets) {
    for (const parameter of set.parameters) {
      if (parameter.name !== trend.parameter || parameter.value === null || !Number.isFinite(parameter.value)) continue;
      if (trend.match && !Object.entries(trend.match).every(([k, v]) => parameter.conditions[k] === v)) continue;
      const x = parameter.conditions[trend.x.key];
      if (typeof x !== "number" || !Number.isFinite(x)) continue;
      const temperature = set.temperatureC !== undefined ? formatTemperature(set.temperatureC) : "";
      let units = byTemperature.get(temperature);
      if (!units) byTemperature.set(temperature, (units = new Map()));
      let points = units.get(set.serial);
      if (!points) units.set(set.serial, (points = new Map()));
      const order = `${set.measuredOn}|${String(set.id).padStart(12, "0")}`;
      const current = points.get(x);
      if (!current || order > current.order) points.set(x, { value: parameter.value, order });
    }
  }
  let best: [string, Map<string, Map<number, { value: number }>>] | null = null;
  for (const entry of [...byTemperature.entries()].sort((a, b) => compareStrings(a[0], b[0]))) {
    if (!best || entry[1].size > best[1].size) best = entry;
  }
  if (!best) return null;
  const xs = new Set<number>();
  for (const points of best[1].values()) for (const x of points.keys()) xs.add(x);
  if (xs.size < 2) return null;
  const sources: ChartSource[] = [...best[1].entries()].map(([serial, points]) => ({
    serial,
    curve: {
      id: trend.id,
      title: trend.title,
      x: { label: trend.x.label, unit: trend.x.unit, scale: "linear" },
      y: { label: trend.y.label, unit: trend.y.unit },
      series: [{ name: trend.y.label, points: [...points.entries()].sort((a, b) => a[0] - b[0]).map(([x, p]) => [x, p.value] as [number, number]) }],
    },
  }));
  return buildChartSpec(trend, sources, { conditionsLabel: best[0], points: true });
}

/**
 * A condition of the set as its parameters carry it. Not every parameter carries every key, and
 * band parameters carry their own start and stop: the smallest value (the largest for "max"),
 * so the order of the parameters cannot matter.
 */
function setCondition(set: ApprovedSetInput, key: string, pick: "min" | "max" = "min"): number | undefined {
  let found: number | undefined;
  for (const parameter of set.parameters) {
    const value = parameter.conditions[key];
    if (typeof value !== "number") continue;
    if (found === undefined || (pick === "min" ? value < found : value > found)) found = value;
  }
  return found;
}

/** The frequency a set was measured at (input, carrier or band start), for ordering; 0 if none. */
function setFrequencyHz(set: ApprovedSetInput): number {
  return setCondition(set, "inputFrequencyHz") ?? setCondition(set, "carrierFrequencyHz") ?? setCondition(set, "startHz") ?? 0;
}

function describeSetConditions(set: ApprovedSetInput): string {
  const parts: string[] = [];
  const input = setCondition(set, "inputFrequencyHz");
  const carrier = setCondition(set, "carrierFrequencyHz");
  const start = setCondition(set, "startHz");
  const stop = setCondition(set, "stopHz", "max");
  if (input !== undefined) parts.push(`${formatQuantity(input, "Hz")} in`);
  else if (carrier !== undefined) parts.push(`${formatQuantity(carrier, "Hz")} out`);
  else if (start !== undefined && stop !== undefined) parts.push(formatRange(start, stop, "Hz"));
  if (set.temperatureC !== undefined) parts.push(formatTemperature(set.temperatureC));
  return parts.join(", ");
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

function buildTraceability(sets: ApprovedSetInput[], issues: SheetModel["issues"]): SheetModel["traceability"] {
  const instruments = new Map<string, SheetModel["traceability"]["instruments"][number]>();
  for (const set of sets) {
    for (const instrument of set.instruments) {
      const key = [instrument.kind, instrument.model, instrument.serial, instrument.calibratedOn].join("|");
      const lapsed = set.measuredOn > instrument.calibrationDueOn || set.measuredOn < instrument.calibratedOn;
      if (lapsed) {
        issues.push({
          code: "calibration-lapsed",
          message: `Set ${String(set.id)} (${set.serial}) was measured on ${set.measuredOn}, outside the calibration interval of ${instrument.model} ${instrument.serial} (${instrument.calibratedOn} to ${instrument.calibrationDueOn}).`,
        });
      }
      const existing = instruments.get(key);
      if (existing) {
        existing.setCount++;
        existing.calibrationLapsed ||= lapsed;
        continue;
      }
      instruments.set(key, {
        kind: instrument.kind,
        model: instrument.model,
        serial: instrument.serial,
        calibratedOn: instrument.calibratedOn,
        calibrationDueOn: instrument.calibrationDueOn,
        uncertainty: [...instrument.uncertainty]
          .sort((a, b) => compareStrings(a.quantity, b.quantity))
          .map((u) => `${u.quantity}: ±${formatQuantity(u.value, u.unit, { digits: { maxDecimals: 4 } })} (k = ${formatNumber(u.coverageFactor, { digits: { maxDecimals: 2 } })})`),
        setCount: 1,
        calibrationLapsed: lapsed,
      });
    }
  }
  return {
    measurementSets: sets.map((set) => ({
      id: String(set.id),
      kind: set.kind,
      serial: set.serial,
      lot: set.lot ?? null,
      temperature: set.temperatureC === undefined ? "" : formatTemperature(set.temperatureC),
      measuredOn: set.measuredOn,
    })),
    instruments: [...instruments.values()].sort(
      (a, b) => compareStrings(a.kind, b.kind) || compareStrings(a.model, b.model) || compareStrings(a.serial, b.serial) || compareStrings(a.calibratedOn, b.calibratedOn),
    ),
    statements: [
      "Results refer only to the units listed, measured on the dates shown with the instruments listed (ISO/IEC 17025:2017 §7.8.2.1).",
      "Calibration dates and stated uncertainties are those on record for each instrument when the sheet was built.",
      "Only measurement sets approved by a second engineer contribute to the statistics.",
    ],
  };
}

function buildKeyFacts(conditions: SheetInput["device"]["keyConditions"]): SheetModel["keyFacts"] {
  const facts: SheetModel["keyFacts"] = [];
  const range = (label: string, r: { min: number; max: number } | undefined) => {
    if (!r) return;
    facts.push({ label, ...rangeParts(r.min, r.max, "Hz") });
  };
  range("Input frequency", conditions.inputFrequencyHz);
  range("Output frequency", conditions.outputFrequencyHz);
  if (conditions.driveLevelDbm !== undefined) {
    facts.push({ label: "Drive level", ...quantityParts(conditions.driveLevelDbm, "dBm", { signed: true, digits: { maxDecimals: 1 } }) });
  }
  if (conditions.multiplicationFactor !== undefined) {
    facts.push({ label: "Multiplication factor", value: `×${formatNumber(conditions.multiplicationFactor, { digits: { maxDecimals: 0 } })}`, unit: "" });
  }
  return facts;
}
