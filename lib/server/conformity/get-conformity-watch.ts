import "server-only";
import { Op } from "sequelize";
import { AppError } from "@/lib/errors";
import { buildVegaLiteSpec } from "@/lib/charts";
import type { ConformityAlertView, ConformityWatchView } from "@/lib/domain/conformity";
import { formatQuantity } from "@/lib/format/quantity";
import { assessConformity, controlChartData } from "@/lib/sheet/conformity-watch";
import { plainNotation } from "@/lib/sheet/notation";
import { runRuleSource, runRuleWords, type RunRuleNumber } from "@/lib/stats/run-rules";
import { db } from "@/models";
import type { ConformityAlert, MeasurementSet, SheetRevision, User } from "@/models";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { loadWatchInput } from "./load-watch";

export const conformityMethod =
  "Each unit approved since the release is judged against the released guaranteed limits with the decision rule the release states " +
  "(ILAC-G8:09/2019 §4.2.2 guarded acceptance w = U where the release states U, §4.2.1 simple acceptance otherwise). " +
  "For each guaranteed parameter, the condition group the release measured on the most units is followed on an individuals chart " +
  "whose centre line and sigma are the release's mean and standard deviation (n − 1): the release's units have no time order for a " +
  "moving range, and new units are judged against the population that justified the limits. " +
  `Tests for special causes: Nelson's eight (${runRuleSource}).`;

type AlertRow = ConformityAlert & { MeasurementSet?: MeasurementSet; SheetRevision?: SheetRevision; closedBy?: User | null };

/**
 * The device's conformity watch for one of its organization's engineers or reviewers: the current
 * revision, how many units since its release sit inside each guaranteed limit, the control charts
 * (specs from lib/charts) and the alerts, open first. The device page and the API both call this.
 */
export async function getConformityWatch(opts: { viewer: SessionUser; deviceId: number }): Promise<ConformityWatchView> {
  const { viewer, deviceId } = opts;
  authorize(viewer, "conformity");
  const { Device, ConformityAlert, MeasurementSet, SheetRevision, User } = db();
  const device = await Device.findOne({ where: { id: deviceId, organizationId: viewer.organizationId }, attributes: ["id"] });
  if (!device) throw new AppError("not-found", "No such device in your organization.");
  const [input, alertRows] = await Promise.all([
    loadWatchInput({ organizationId: viewer.organizationId, deviceId }),
    ConformityAlert.findAll({
      where: { organizationId: viewer.organizationId, deviceId },
      include: [
        { model: MeasurementSet, attributes: ["id", "conditions"] },
        { model: SheetRevision, attributes: ["id", "letter"] },
        { model: User, as: "closedBy", attributes: ["id", "name"] },
      ],
      order: [
        [ConformityAlert.sequelize!.literal("`ConformityAlert`.`closed_at` IS NULL"), "DESC"],
        ["id", "DESC"],
      ],
      limit: 100,
    }) as Promise<AlertRow[]>,
  ]);
  const alerts: ConformityAlertView[] = alertRows.map((a) => ({
    id: a.id,
    measurementSetId: a.measurementSetId,
    serial: a.MeasurementSet?.conditions.serial ?? "",
    revisionLetter: a.SheetRevision?.letter ?? "",
    raisedAt: a.raisedAt.toISOString(),
    summary: a.summary,
    findings: a.findings.map((f) => f.message),
    closed: a.closedAt ? { at: a.closedAt.toISOString(), by: a.closedBy?.name ?? "", reason: a.closeReason ?? "" } : null,
  }));
  if (!input) return { deviceId, revision: null, setCount: 0, limits: [], charts: [], notes: [], method: conformityMethod, alerts };

  const assessment = assessConformity(input);
  const q = (value: number, unit: string) => formatQuantity(value, unit, { digits: { maxDecimals: 3 } });
  return {
    deviceId,
    revision: { id: input.revision.id, letter: input.revision.letter, releasedAt: input.revision.releasedAt.toISOString() },
    setCount: input.sets.length,
    limits: assessment.groups.map((g) => ({
      groupId: g.groupId,
      label: g.label,
      symbol: g.symbol,
      conditionsText: g.conditionsText,
      limitText: g.limitText,
      inside: g.insideCount,
      outside: g.outsideCount,
    })),
    charts: assessment.charts.flatMap((chart) => {
      const built = chart.points.length ? buildVegaLiteSpec(controlChartData(chart), { medium: "screen", width: "container", height: 240, points: true }) : null;
      if (!built) return [];
      return [
        {
          groupId: chart.groupId,
          label: chart.label,
          conditionsText: chart.conditionsText,
          centreText: q(chart.centre, chart.unit),
          sigmaText: q(chart.sigma, chart.unit),
          releaseUnitCount: chart.releaseUnitCount,
          pointCount: chart.points.length,
          vegaLite: built.vegaLite,
          description: String(built.vegaLite.description ?? ""),
          signals: chart.signals.map((s) => ({
            rule: s.rule,
            words: runRuleWords[s.rule as RunRuleNumber],
            serial: chart.points[s.index].serial,
            setId: chart.points[s.index].setId,
          })),
        },
      ];
    }),
    notes: assessment.notes,
    method: conformityMethod,
    alerts,
  };
}

/** The device's open alerts as the sheet's open issues (loadSheetInput). */
export async function openConformityIssues(opts: { organizationId: number; deviceId: number }): Promise<string[]> {
  const { ConformityAlert } = db();
  const rows = await ConformityAlert.findAll({
    where: { organizationId: opts.organizationId, deviceId: opts.deviceId, closedAt: { [Op.is]: null } },
    attributes: ["id", "summary"],
    order: [["id", "ASC"]],
  });
  // Plain text like the consistency checks' issues: the summary names its row with the T_A notation.
  return rows.map((r) => `Conformity alert #${r.id}: ${plainNotation(r.summary)}. Close it on the device page with a reason, or revise the limits.`);
}
