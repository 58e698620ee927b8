import "server-only";
import type { Transaction } from "sequelize";
import { assessConformity, findingsForSet, type ConformityFinding } from "@/lib/sheet/conformity-watch";
import { runRuleWords } from "@/lib/stats/run-rules";
import { db } from "@/models";
import type { MeasurementSet } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import type { SessionUser } from "../auth/session-user";
import { serverConfig } from "../config";
import { enqueueNotices } from "../outbox/enqueue-notices";
import { conformityAlertWords } from "../outbox/notice-mails";
import { organizationMembers } from "../outbox/organization-members";
import { loadWatchInput } from "./load-watch";

/** A pattern test (2–8) goes on signalling while its run lasts; a unit beyond 3σ or outside a limit is news each time. */
const findingKey = (f: ConformityFinding) => (f.kind === "run-rule" && f.rule !== 1 ? `${f.groupId}|test ${f.rule}` : null);

/**
 * The conformity watch's hook, called in the approval's own transaction once a set is approved: when
 * the device has a current revision, the set is read against it (lib/sheet/conformity-watch), and a
 * unit outside a guaranteed limit or a test that signals at its point raises one alert, with its audit
 * event and one notice to each of the organization's engineers and reviewers (the outbox, so the mail
 * exists exactly when the approval commits). A pattern test (Nelson 2–8) that an open alert already
 * reports for the same parameter is not raised again (a run of ten is the run of nine going on); a unit
 * outside a limit or beyond 3σ always is. The device row is locked so that two approvals of one device read each other's sets.
 */
export async function raiseConformityAlerts(opts: { set: MeasurementSet; reviewer: SessionUser; transaction: Transaction }): Promise<number | null> {
  const { set, reviewer, transaction } = opts;
  const { ConformityAlert, Device, Organization } = db();
  const device = await Device.findOne({ where: { id: set.deviceId, organizationId: set.organizationId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!device) return null;
  const input = await loadWatchInput({ organizationId: set.organizationId, deviceId: set.deviceId, transaction });
  if (!input || !input.sets.some((s) => s.id === set.id)) return null;
  const assessment = assessConformity(input);
  let findings = findingsForSet(assessment, set.id);
  if (findings.length === 0) return null;

  const open = await ConformityAlert.findAll({ where: { deviceId: set.deviceId, revisionId: input.revision.id, closedAt: null }, attributes: ["findings"], transaction });
  const reported = new Set(open.flatMap((a) => a.findings.map(findingKey)).filter(Boolean));
  findings = findings.filter((f) => !reported.has(findingKey(f)));
  if (findings.length === 0) return null;

  const serial = set.conditions.serial;
  const outside = [...new Set(findings.filter((f) => f.kind === "outside-limit").map((f) => `${f.label}${f.conditionsText ? ` (${f.conditionsText})` : ""}`))];
  const tests = [
    ...new Set(
      findings.flatMap((f) => (f.kind === "run-rule" ? [`${f.label}${f.conditionsText ? ` (${f.conditionsText})` : ""}: Nelson test ${f.rule}, ${runRuleWords[f.rule]}`] : [])),
    ),
  ];
  const summary = `Unit ${serial} (set #${set.id}): ${[...outside.map((p) => `${p} outside its guaranteed limit`), ...tests].join("; ")}`;
  const alert = await ConformityAlert.create(
    {
      organizationId: set.organizationId,
      deviceId: set.deviceId,
      revisionId: input.revision.id,
      measurementSetId: set.id,
      findings,
      summary: summary.length > 500 ? `${summary.slice(0, 499)}…` : summary,
      raisedAt: new Date(),
      raisedById: reviewer.id,
    },
    { transaction },
  );
  await recordAuditEvent(
    {
      organizationId: set.organizationId,
      actorUserId: reviewer.id,
      action: "conformity-alert.raise",
      subjectType: "conformity-alert",
      subjectId: alert.id,
      after: { deviceId: set.deviceId, revisionId: input.revision.id, measurementSetId: set.id, findings: findings.map((f) => f.message) },
    },
    transaction,
  );
  const organization = await Organization.findByPk(set.organizationId, { attributes: ["name"], transaction });
  const words = conformityAlertWords({
    partNumber: device.partNumber,
    title: device.title,
    organizationName: organization?.name ?? "",
    link: `${serverConfig.appUrl}/devices/${device.id}#conformity`,
    revisionLetter: input.revision.letter,
    serial,
    setId: set.id,
    outside,
    tests,
  });
  const recipients = await organizationMembers(set.organizationId, ["engineer", "reviewer"], transaction);
  await enqueueNotices(
    transaction,
    recipients.map((to) => ({ organizationId: set.organizationId, eventKey: `conformity-alert:${alert.id}:raised`, to, ...words })),
  );
  return alert.id;
}
