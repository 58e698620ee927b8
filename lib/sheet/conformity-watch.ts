/**
 * The conformity watch: measurement sets approved after a release, read against that release's frozen
 * sheet model. Each guaranteed limit (a min or max the released sheet states) judges every new unit
 * with the decision rule the release printed (guarded acceptance w = U, ILAC-G8:09/2019 §4.2.2, or
 * simple acceptance §4.2.1, through lib/stats decideConformity); and for each guaranteed parameter one
 * condition group, its key condition, is followed on an individuals control chart with Nelson's tests
 * for special causes (lib/stats run-rules).
 *
 * The chart's centre line and sigma are the mean and the sample standard deviation (n − 1) of the units
 * the released sheet was built from, as its statistics annex states them (a "Phase II" chart with the
 * parameters fixed at release). The moving range was not chosen: the release's units carry no time
 * order (the annex lists them by serial, and lots are measured side by side), so MR̄/d₂ of them would
 * depend on the listing order; and the new sets are judged against the population that justified the
 * limits, not against themselves, so a drift that starts right after release is still seen.
 *
 * Pure: the server hands it the frozen model, the template and the sets; pages draw what it returns.
 */
import type { SheetTemplate } from "../../templates/types";
import { formatQuantity } from "../format/quantity";
import { decideConformity, type DecisionRule } from "../stats/decision";
import { evaluateRunRules, runRuleWords, type RunRuleNumber, type RunRuleSignal } from "../stats/run-rules";
import type { ChartData } from "../charts/build-vega-lite-spec";
import { collectGroupValues } from "./spec-table";
import type { ApprovedSetInput, SheetModel, StatisticsGroup } from "./types";

/** A set approved after the release, oldest approval first. */
/** Its curves too: a row at a stated drive reads each unit off its stored sweep (lib/sheet/stated-drive.ts). */
export type WatchedSet = Pick<ApprovedSetInput, "id" | "kind" | "serial" | "lot" | "temperatureC" | "measuredOn" | "parameters" | "curves">;

interface GroupRef {
  groupId: string;
  rowId: string;
  parameter: string;
  label: string;
  symbol: string;
  unit: string;
  conditionsText: string;
}

export interface WatchedUnit {
  setId: string;
  serial: string;
  value: number;
  decision: "pass" | "fail";
}

/** One guaranteed limit of the released sheet and the units measured against it since. */
export interface GuaranteedGroupWatch extends GroupRef {
  min: number | null;
  max: number | null;
  decisionRule: DecisionRule;
  expandedUncertainty: number;
  acceptanceLower: number | null;
  acceptanceUpper: number | null;
  /** The limit in words as the alert prints it: "max 9.5 dB (accepted up to 9.3 dB, guarded acceptance w = U)". */
  limitText: string;
  units: WatchedUnit[];
  insideCount: number;
  outsideCount: number;
}

export interface ControlPoint {
  setId: string;
  serial: string;
  value: number;
}

/** The individuals chart of one guaranteed parameter at its key condition. */
export interface ControlChartWatch extends GroupRef {
  centre: number;
  sigma: number;
  /** Units the release's mean and sigma come from. */
  releaseUnitCount: number;
  upperControlLimit: number;
  lowerControlLimit: number;
  min: number | null;
  max: number | null;
  points: ControlPoint[];
  signals: RunRuleSignal[];
}

export interface ConformityAssessment {
  groups: GuaranteedGroupWatch[];
  charts: ControlChartWatch[];
  /** Guaranteed parameters without a chart, and why (too few units at release, no spread, no rule). */
  notes: string[];
}

export type ConformityFinding =
  | (GroupRef & { kind: "outside-limit"; setId: string; serial: string; value: number; limitText: string; message: string })
  | (GroupRef & { kind: "run-rule"; rule: RunRuleNumber; setId: string; points: string[]; message: string });

/** A group states a guaranteed limit when the released sheet prints a min or a max for it. */
function guaranteedLimits(group: StatisticsGroup): { min: number | null; max: number | null } | null {
  const min = group.limits?.min.value ?? null;
  const max = group.limits?.max.value ?? null;
  return min === null && max === null ? null : { min, max };
}

function ref(group: StatisticsGroup): GroupRef {
  const { groupId, rowId, parameter, label, symbol, unit, conditionsText } = group;
  return { groupId, rowId, parameter, label, symbol, unit, conditionsText };
}

const q = (value: number, unit: string) => formatQuantity(value, unit, { digits: { maxDecimals: 3 } });

function describeLimit(min: number | null, max: number | null, lower: number | null, upper: number | null, rule: DecisionRule, unit: string): string {
  const stated = [min !== null ? `min ${q(min, unit)}` : null, max !== null ? `max ${q(max, unit)}` : null].filter(Boolean).join(", ");
  if (rule === "simple-acceptance") return `${stated} (simple acceptance, w = 0)`;
  const accepted =
    lower !== null && upper !== null ? `accepted ${q(lower, unit)} to ${q(upper, unit)}` : lower !== null ? `accepted from ${q(lower, unit)}` : `accepted up to ${q(upper!, unit)}`;
  return `${stated} (${accepted}, guarded acceptance w = U)`;
}

/**
 * Reads the sets approved since the release against its frozen model. The template is the device
 * class's, which groups a set's values exactly as the released sheet grouped its own.
 */
export function assessConformity(opts: { model: SheetModel; template: SheetTemplate; sets: WatchedSet[] }): ConformityAssessment {
  const { model, template, sets } = opts;
  // One value per set and group: each set is grouped alone, so a unit measured twice is two points.
  const perSet = sets.map((set) => ({
    setId: String(set.id),
    serial: set.serial,
    values: collectGroupValues(template, [{ ...set, instruments: [] }]),
  }));
  const groups: GuaranteedGroupWatch[] = [];
  const notes: string[] = [];
  const guaranteed = model.statistics.groups.filter((g) => guaranteedLimits(g) !== null);
  for (const group of guaranteed) {
    const { min, max } = guaranteedLimits(group)!;
    const rule: DecisionRule = group.decisionRule ?? "simple-acceptance";
    const u = rule === "guard-band" ? (group.expandedUncertainty.value ?? 0) : 0;
    const units: WatchedUnit[] = [];
    let acceptanceLower: number | null = null;
    let acceptanceUpper: number | null = null;
    try {
      for (const s of perSet) {
        const value = s.values.get(group.groupId)?.[0]?.value;
        if (value === undefined) continue;
        const judged = decideConformity({ measuredValue: value, lowerLimit: min ?? undefined, upperLimit: max ?? undefined, expandedUncertainty: u, rule, unit: group.unit });
        units.push({ setId: s.setId, serial: s.serial, value, decision: judged.decision });
      }
      acceptanceLower = min === null ? null : min + (rule === "guard-band" ? u : 0);
      acceptanceUpper = max === null ? null : max - (rule === "guard-band" ? u : 0);
      if (acceptanceLower !== null && acceptanceUpper !== null && acceptanceLower > acceptanceUpper) throw new RangeError("closed");
    } catch {
      notes.push(`${group.label} (${group.conditionsText || "all conditions"}): the released guard bands leave no acceptance zone, so new units cannot be judged.`);
      continue;
    }
    const outsideCount = units.filter((unit) => unit.decision === "fail").length;
    groups.push({
      ...ref(group),
      min,
      max,
      decisionRule: rule,
      expandedUncertainty: u,
      acceptanceLower,
      acceptanceUpper,
      limitText: describeLimit(min, max, acceptanceLower, acceptanceUpper, rule, group.unit),
      units,
      insideCount: units.length - outsideCount,
      outsideCount,
    });
  }

  const charts: ControlChartWatch[] = [];
  for (const rowId of [...new Set(guaranteed.map((g) => g.rowId))]) {
    const key = keyGroup(guaranteed.filter((g) => g.rowId === rowId));
    const centre = key.mean.value;
    const sigma = key.standardDeviation.value;
    if (key.n < 2 || centre === null || sigma === null || !(sigma > 0)) {
      notes.push(`${key.label}: no control chart, since the release had ${key.n < 2 ? `${key.n} unit` : "no spread between its units"} at ${key.conditionsText || "its condition"}.`);
      continue;
    }
    const points = perSet.flatMap((s) => {
      const value = s.values.get(key.groupId)?.[0]?.value;
      return value === undefined ? [] : [{ setId: s.setId, serial: s.serial, value }];
    });
    const { min, max } = guaranteedLimits(key)!;
    charts.push({
      ...ref(key),
      centre,
      sigma,
      releaseUnitCount: key.n,
      upperControlLimit: centre + 3 * sigma,
      lowerControlLimit: centre - 3 * sigma,
      min,
      max,
      points,
      signals: points.length ? evaluateRunRules(points.map((p) => p.value), { centre, sigma }) : [],
    });
  }
  return { groups, charts, notes };
}

/**
 * A parameter's key condition: of its guaranteed groups, the one the release measured on the most
 * units (its statistics are the firmest), the first in the sheet's order on a tie.
 */
function keyGroup(groups: StatisticsGroup[]): StatisticsGroup {
  return groups.reduce((best, g) => (g.n > best.n ? g : best));
}

/**
 * What a newly approved set raises: each guaranteed limit its unit falls outside, and each test that
 * signals at its point on a control chart.
 */
export function findingsForSet(assessment: ConformityAssessment, setId: string | number): ConformityFinding[] {
  const id = String(setId);
  const findings: ConformityFinding[] = [];
  for (const group of assessment.groups) {
    const unit = group.units.find((u) => u.setId === id && u.decision === "fail");
    if (!unit) continue;
    const where = group.conditionsText ? ` at ${group.conditionsText}` : "";
    findings.push({
      kind: "outside-limit",
      ...pickRef(group),
      setId: id,
      serial: unit.serial,
      value: unit.value,
      limitText: group.limitText,
      message: `Unit ${unit.serial} (set #${id}): ${group.label}${where} reads ${q(unit.value, group.unit)}, outside the guaranteed ${group.limitText}.`,
    });
  }
  for (const chart of assessment.charts) {
    const index = chart.points.findIndex((p) => p.setId === id);
    if (index < 0) continue;
    const where = chart.conditionsText ? ` at ${chart.conditionsText}` : "";
    for (const signal of chart.signals.filter((s) => s.index === index)) {
      findings.push({
        kind: "run-rule",
        ...pickRef(chart),
        rule: signal.rule,
        setId: id,
        points: signal.points.map((k) => chart.points[k].setId),
        message: `${chart.label}${where}: Nelson test ${signal.rule}, ${runRuleWords[signal.rule]}, ends at unit ${chart.points[index].serial} (set #${id}); centre ${q(chart.centre, chart.unit)}, σ ${q(chart.sigma, chart.unit)} from the ${chart.releaseUnitCount} units at release.`,
      });
    }
  }
  return findings;
}

function pickRef(g: GroupRef): GroupRef {
  const { groupId, rowId, parameter, label, symbol, unit, conditionsText } = g;
  return { groupId, rowId, parameter, label, symbol, unit, conditionsText };
}

/**
 * The chart's data for lib/charts: the units in approval order (x: 1, 2, …), the centre line and the
 * 3σ control limits, the guaranteed limits, and an open circle on every point where a test signals.
 */
export function controlChartData(chart: ControlChartWatch): ChartData {
  const series = `${chart.label} per unit`;
  const rules = [
    { y: chart.upperControlLimit, label: "UCL (+3σ)", decimals: 3 },
    { y: chart.centre, label: "Centre (release mean)", decimals: 3 },
    { y: chart.lowerControlLimit, label: "LCL (−3σ)", decimals: 3 },
    ...(chart.max !== null ? [{ y: chart.max, label: "Guaranteed max", decimals: 3 }] : []),
    ...(chart.min !== null ? [{ y: chart.min, label: "Guaranteed min", decimals: 3 }] : []),
  ];
  const signalled = new Map<number, number[]>();
  for (const s of chart.signals) signalled.set(s.index, [...(signalled.get(s.index) ?? []), s.rule]);
  return {
    title: `${chart.label}${chart.conditionsText ? `, ${chart.conditionsText}` : ""}: individuals chart since release`,
    x: { label: "Unit since release", unit: "", counting: true },
    y: { label: chart.label, unit: chart.unit },
    seriesNames: [series],
    traces: [{ series, points: chart.points.map((p, i) => [i + 1, p.value] as const) }],
    markers: [...signalled].map(([index, rules]) => ({
      x: index + 1,
      y: chart.points[index].value,
      label: `Nelson test ${rules.join(", ")}`,
      // The page lists every signal in words under the chart; the corner would crowd the limit labels.
      inCorner: false,
    })),
    rules,
  };
}
