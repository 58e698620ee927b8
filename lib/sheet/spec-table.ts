import { limitBasisWords } from "../domain/sheets";
import { specRowName } from "../domain/parameter-names";
import { lowerFirst } from "../format/text";
import type { SheetTemplate, SpecRowTemplate } from "../../templates/types";
import { compareStrings } from "./compare";
import { formatConditionCell, makeConditionsKey, parseConditionsKey, type Conditions } from "./conditions";
import { formatDrive, formatLimitValue, formatTemperatureRange, formatValue, typicalDecimals } from "./format";
import { readAtStatedDrive, type StatedDriveMiss } from "./stated-drive";
import { computeGroupStatistics, DEFAULT_CPK_MIN_UNITS, type GroupStatistics, type UnitValue } from "./statistics";
import type { LimitBasis } from "../domain/sheets";
import type { ApprovedSetInput, GroupIdentity, SheetInput, SheetModel, SpecLimitInput, SpecTableRow, StatisticsGroup } from "./types";

const MEASURED_MEAN_FOOTNOTE =
  "No typical value is stated: the figure is the mean of the units measured (n in the statistics annex), " +
  "rounded to the decade of their spread s (JCGM 100:2008 §7.2.6).";
/** The same for a row behind which one unit was measured: there is no spread to round to. */
const ONE_UNIT_FOOTNOTE =
  "No typical value is stated: the figure is the one unit measured (see the statistics annex), printed to the row's " +
  "usual decimals; one unit shows no spread to round it to.";

type Issues = SheetModel["issues"];

export interface SpecTable {
  rows: SpecTableRow[];
  /** One statistics group per row of the table, in the same order. */
  groups: StatisticsGroup[];
  footnotes: { mark: string; text: string }[];
  decisionRules: string[];
  /** Duplicate limits, then limits that match no row. */
  issues: Issues;
}

/**
 * The electrical specification table and its statistics: one row per template row and
 * condition group that has measured values or a limit, with the limits that fed it, its
 * footnotes and the decision rules its acceptance used.
 */
export function buildSpecTable(options: {
  template: SheetTemplate;
  sets: ApprovedSetInput[];
  limits: SpecLimitInput[];
  settings: SheetInput["settings"];
  classLabel: string;
}): SpecTable {
  const { template, sets, settings } = options;
  const { limits, duplicateIssues } = indexLimits(options.limits);
  const usedLimits = new Set<string>();
  const footnotes = createFootnotes();
  const decisionRules = new Set<string>();
  const rows: SpecTableRow[] = [];
  const groups: StatisticsGroup[] = [];

  const uncoveredSpans: Issues = [];
  for (const row of template.specifications.rows) {
    // A row over temperature: its groups, and the spans no unit covers end to end, from one pass over the sets.
    const overTemperature = row.overTemperature ? overTemperatureGroups(row, row.overTemperature, sets) : undefined;
    const collected = overTemperature ? overTemperature.values : collectRowValues(row, sets);
    for (const span of overTemperature?.uncovered ?? []) {
      const issue = uncoveredSpanIssue(row, span);
      if (!uncoveredSpans.some((known) => known.message === issue.message)) uncoveredSpans.push(issue); // once per row and span
    }
    addLimitOnlyGroups(row, collected, limits, usedLimits);
    for (const conditionsKey of orderedConditionKeys(row, collected)) {
      const limitKey = `${row.parameter}|${conditionsKey}`;
      const limit = limits.get(limitKey);
      if (limit) usedLimits.add(limitKey);
      const conditions = parseConditionsKey(conditionsKey);
      const conditionCells = template.specifications.conditionColumns.map((column) => formatConditionCell(column, conditions, row.id));
      const stats = computeGroupStatistics({
        label: specRowName(row),
        unit: row.unit,
        decimals: row.decimals,
        values: collected.get(conditionsKey) ?? [],
        limit,
        expandedUncertainty: settings.measurementUncertainty?.[row.parameter],
        cpkThreshold: settings.cpkThreshold,
        cpkMinUnits: settings.cpkMinUnits ?? DEFAULT_CPK_MIN_UNITS,
        coverage: settings.toleranceCoverage,
        confidence: settings.toleranceConfidence,
      });
      if (stats.ruleStatement) decisionRules.add(stats.ruleStatement);
      const cell = { row, conditionsKey, limit, stats };
      groups.push(buildStatisticsGroup(cell, describeConditions(template, conditionCells)));
      rows.push(buildSpecRow(cell, conditionCells, footnotes.markFor));
    }
  }

  return {
    rows,
    groups,
    footnotes: footnotes.list,
    decisionRules: [...decisionRules].sort(),
    issues: [
      ...duplicateIssues,
      ...unusedLimitIssues(limits, usedLimits, options.classLabel),
      ...statedDriveIssues(template, sets),
      ...uncoveredSpans,
    ],
  };
}

/**
 * The values of the sets by statistics group (`rowId:conditionsKey`), one per unit, grouped exactly as
 * the specification table groups them: what the conformity watch reads a newly approved set with.
 */
export function collectGroupValues(template: SheetTemplate, sets: ApprovedSetInput[]): Map<string, UnitValue[]> {
  const result = new Map<string, UnitValue[]>();
  for (const row of template.specifications.rows) {
    for (const [conditionsKey, values] of collectRowValues(row, sets)) result.set(groupIdentity(row, conditionsKey).groupId, values);
  }
  return result;
}

/** One cell of the table's loop: a template row under one condition group. */
interface RowGroup {
  row: SpecRowTemplate;
  conditionsKey: string;
  limit: SpecLimitInput | undefined;
  stats: GroupStatistics;
}

/** The names a template row under one condition group goes by, in the statistics and in the spec table alike. */
function groupIdentity(row: SpecRowTemplate, conditionsKey: string): GroupIdentity {
  return {
    groupId: `${row.id}:${conditionsKey}`,
    rowId: row.id,
    parameter: row.parameter,
    conditionsKey,
    label: specRowName(row),
    symbol: row.symbol,
    unit: row.unit,
  };
}

/**
 * The basis a group states when no limit gives one: the row's default, except that a figure with no
 * limit is screened on no unit, so "tested on every unit" cannot be its basis: characterization (a row
 * at another temperature or input frequency than production test's, say).
 */
function unlimitedBasis(row: SpecRowTemplate): LimitBasis {
  return row.defaultBasis === "test" ? "characterization" : row.defaultBasis;
}

function buildStatisticsGroup({ row, conditionsKey, limit, stats }: RowGroup, conditionsText: string): StatisticsGroup {
  const basis = limit?.basis ?? unlimitedBasis(row);
  return {
    ...groupIdentity(row, conditionsKey),
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
          min: formatLimitValue(limit.min, limit.decimals?.min),
          typ: formatLimitValue(limit.typ, limit.decimals?.typ),
          max: formatLimitValue(limit.max, limit.decimals?.max),
          basis,
        }
      : null,
    cpk: stats.cpk,
    ...(stats.cpkInterval ? { cpkInterval: stats.cpkInterval } : {}),
    expandedUncertainty: stats.expandedUncertainty,
    decisionRule: stats.decisionRule,
    acceptance: stats.acceptance,
    passCount: stats.passCount,
    failCount: stats.failCount,
    units: stats.units,
    flags: stats.flags,
    supported: stats.flags.length === 0,
    ...(stats.cpkAbsentReason ? { cpkAbsentReason: stats.cpkAbsentReason } : {}),
  };
}

function buildSpecRow(
  { row, conditionsKey, limit, stats }: RowGroup,
  conditionCells: string[],
  footnoteMark: (text: string) => string,
): SpecTableRow {
  const basis = limit?.basis ?? unlimitedBasis(row);
  const typIsMeasuredMean = limit?.typ === undefined && stats.meanValue !== null;
  const marks: string[] = [];
  if (limit?.footnote) marks.push(footnoteMark(limit.footnote.trim()));
  if (typIsMeasuredMean) marks.push(footnoteMark(stats.n < 2 ? ONE_UNIT_FOOTNOTE : MEASURED_MEAN_FOOTNOTE));
  return {
    ...groupIdentity(row, conditionsKey),
    conditions: conditionCells,
    min: formatLimitValue(limit?.min, limit?.decimals?.min),
    typ: typIsMeasuredMean
      ? formatValue(stats.meanValue, typicalDecimals({ standardDeviation: stats.spreadValue, n: stats.n, templateDecimals: row.decimals }))
      : formatLimitValue(limit?.typ, limit?.decimals?.typ),
    max: formatLimitValue(limit?.max, limit?.decimals?.max),
    typIsMeasuredMean,
    basis,
    basisMark: limitBasisWords[basis].mark,
    footnoteMarks: marks,
    n: stats.n,
    supported: stats.flags.length === 0,
  };
}

/** "Label value" for each condition column that has a value, for the statistics annex. */
function describeConditions(template: SheetTemplate, conditionCells: string[]): string {
  return template.specifications.conditionColumns
    .map((column, i) => (conditionCells[i] ? `${column.label} ${conditionCells[i]}` : ""))
    .filter(Boolean)
    .join(", ");
}

/** Footnotes numbered in order of first use; the same text keeps its mark. */
function createFootnotes() {
  const list: { mark: string; text: string }[] = [];
  const markFor = (text: string): string => {
    const existing = list.find((f) => f.text === text);
    if (existing) return existing.mark;
    const mark = String(list.length + 1);
    list.push({ mark, text });
    return mark;
  };
  return { list, markFor };
}

/** A limit with no measured values still gets its row, when its conditions fit the template row. */
function addLimitOnlyGroups(
  row: SpecRowTemplate,
  collected: Map<string, UnitValue[]>,
  limits: Map<string, SpecLimitInput>,
  usedLimits: Set<string>,
): void {
  for (const [key, limit] of limits) {
    if (limit.parameter !== row.parameter || usedLimits.has(key)) continue;
    if (!collected.has(limit.conditionsKey) && limitFitsRow(row, limit)) collected.set(limit.conditionsKey, []);
  }
}

function orderedConditionKeys(row: SpecRowTemplate, collected: Map<string, UnitValue[]>): string[] {
  return [...collected.keys()].sort((a, b) => compareConditions(parseConditionsKey(a), parseConditionsKey(b), row.groupBy));
}

/**
 * Units whose stored sweep does not reach a row's stated drive, one issue per unit and set naming the rows
 * it is left out of: the figure is not extrapolated, and the unit is not dropped silently.
 */
function statedDriveIssues(template: SheetTemplate, sets: ApprovedSetInput[]): Issues {
  const bySet = new Map<string, { miss: StatedDriveMiss; labels: string[] }>();
  for (const row of template.specifications.rows) {
    if (!row.atStatedDrive) continue;
    for (const set of sets) {
      for (const miss of readAtStatedDrive(row, set).misses) {
        const key = `${miss.serial}|${miss.setId}|${miss.driveDbm}`;
        const entry = bySet.get(key) ?? { miss, labels: [] };
        bySet.set(key, entry);
        const label = lowerFirst(specRowName(row));
        if (!entry.labels.includes(label)) entry.labels.push(label);
      }
    }
  }
  return [...bySet.values()]
    .sort((a, b) => compareStrings(a.miss.serial, b.miss.serial) || compareStrings(a.miss.setId, b.miss.setId))
    .map(({ miss, labels }) => ({
      code: "stated-drive-outside-sweep",
      message:
        `Unit ${miss.serial} (set ${miss.setId}) was swept ` +
        (miss.sweep ? `from ${formatDrive(miss.sweep.min)} to ${formatDrive(miss.sweep.max)} per port` : "with no curve against per-port drive") +
        `, which does not reach the stated drive of ${formatDrive(miss.driveDbm)} per port: it is left out of ${labels.join(", ")} (no figure is extrapolated).`,
    }));
}

/**
 * A row over temperature whose sets span two or more temperatures but no unit was measured at both ends:
 * the row is left out (overTemperatureGroups), and the sheet says why.
 */
function uncoveredSpanIssue(row: SpecRowTemplate, span: { lowest: number; highest: number }): Issues[number] {
  return {
    code: "temperature-span-not-covered",
    message:
      `${specRowName(row)}: no unit was measured at both ends of ${formatTemperatureRange(span.lowest, span.highest)}, ` +
      `so the row over that span is left out; each unit's figures stay in the rows at the temperatures it was measured at.`,
  };
}

function unusedLimitIssues(limits: Map<string, SpecLimitInput>, usedLimits: Set<string>, classLabel: string): Issues {
  const issues: Issues = [];
  for (const [key, limit] of limits) {
    if (!usedLimits.has(key)) {
      issues.push({
        code: "limit-not-shown",
        message: `The limit for ${limit.parameter} at "${limit.conditionsKey}" matches no row of the ${classLabel.toLowerCase()} template.`,
      });
    }
  }
  return issues;
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
  const duplicateIssues: Issues = [];
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
  const keys = row.overTemperature ? [...row.groupBy.filter((k) => k !== "temperatureC"), "temperatureMinC", "temperatureMaxC"] : row.groupBy;
  for (const key of keys) if (conditions[key] !== undefined) picked[key] = conditions[key];
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
  if (row.overTemperature) return collectOverTemperatureValues(row, row.overTemperature, sets);
  const byGroup = new Map<string, Map<string, Candidate>>();
  for (const set of sets) {
    const setId = String(set.id);
    const parameters = row.atStatedDrive ? readAtStatedDrive(row, set).parameters : set.parameters;
    for (const parameter of parameters) {
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
 * A row over temperature: the values of the row's groups taken without their temperature, per unit and
 * temperature the latest set (as in any row), then per unit its worst value over its temperatures (the
 * highest for "max", the lowest for "min"). A group is kept only when its sets span two or more
 * temperatures, and carries that span as temperatureMinC and temperatureMaxC. A set's temperature is its
 * own condition: the file's temperature line or the upload's field (lib/ingest mergeUploadConditions).
 */
function collectOverTemperatureValues(row: SpecRowTemplate, worst: "max" | "min", sets: ApprovedSetInput[]): Map<string, UnitValue[]> {
  return overTemperatureGroups(row, worst, sets).values;
}

/** The groups of a row over temperature, and the spans that no unit covers end to end (left out, named in an issue). */
function overTemperatureGroups(
  row: SpecRowTemplate,
  worst: "max" | "min",
  sets: ApprovedSetInput[],
): { values: Map<string, UnitValue[]>; uncovered: { lowest: number; highest: number }[] } {
  const perTemperature = collectRowValues({ ...row, overTemperature: undefined, groupBy: [...row.groupBy.filter((k) => k !== "temperatureC"), "temperatureC"] }, sets);
  type Unit = { worst: UnitValue; temperatures: Set<number> };
  const byGroup = new Map<string, { temperatures: Set<number>; units: Map<string, Unit> }>();
  for (const [key, values] of perTemperature) {
    const { temperatureC, ...rest } = parseConditionsKey(key);
    if (typeof temperatureC !== "number") continue;
    const groupKey = makeConditionsKey(rest);
    let group = byGroup.get(groupKey);
    if (!group) byGroup.set(groupKey, (group = { temperatures: new Set(), units: new Map() }));
    group.temperatures.add(temperatureC);
    for (const value of values) {
      const current = group.units.get(value.serial);
      if (!current) group.units.set(value.serial, { worst: value, temperatures: new Set([temperatureC]) });
      else {
        current.temperatures.add(temperatureC);
        if (worst === "max" ? value.value > current.worst.value : value.value < current.worst.value) current.worst = value;
      }
    }
  }
  // Only the units measured at both ends of the span speak for it: a unit measured at 25 °C alone would put its
  // 25 °C figure among the worst over temperature and pull the row's typical value and spread towards 25 °C.
  const result = new Map<string, UnitValue[]>();
  const uncovered: { lowest: number; highest: number }[] = [];
  for (const [groupKey, { temperatures, units }] of byGroup) {
    if (temperatures.size < 2) continue;
    const [lowest, highest] = [Math.min(...temperatures), Math.max(...temperatures)];
    const spanning = [...units.values()].filter((u) => u.temperatures.has(lowest) && u.temperatures.has(highest)).map((u) => u.worst);
    if (spanning.length === 0) {
      uncovered.push({ lowest, highest });
      continue;
    }
    const conditions = { ...parseConditionsKey(groupKey), temperatureMinC: lowest, temperatureMaxC: highest };
    result.set(makeConditionsKey(conditions), spanning.sort((a, b) => compareStrings(a.serial, b.serial)));
  }
  return { values: result, uncovered };
}
