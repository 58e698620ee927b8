/**
 * The demo's reviews and releases, played through the app's API by the demo's own engineers and
 * reviewers (models/seeders/demo-releases.ts holds what they write): the Kestrine doubler released
 * as revision A, then a fourth unit approved, a resubmission sent back, the conversion-loss limit
 * tightened and revision B released; the mixer, the hybrid and the Pellacourt splitter released as
 * A; one sheet left in review with a comment thread and one with changes requested.
 * Every step looks at where the sheet stands first (its revisions, its open candidate), so a second
 * run on the same database releases nothing again and a run cut short carries on where it stopped.
 */
import type { CandidateDetail, CandidateSummary, RevisionSummary } from "../lib/domain/reviews";
import type { MeasurementSetSummary } from "../lib/domain/measurements";
import type { SheetModel } from "../lib/sheet";
import { demoUploads } from "../models/seeders/demo-measurements";
import { demoChangesRequested, demoDoublerStory, demoFirstReleases, demoOpenReview, type DemoRole } from "../models/seeders/demo-releases";
import { demoOrganizations, demoPassword } from "../models/seeders/demo-scenario";
import { demoSheets, type DemoSheetContent } from "../models/seeders/demo-sheets";
import { demoDesignIn, type DemoDesignIn } from "../models/seeders/demo-design-in";
import { DemoApiSession } from "./demo-api-session";
import { closeDemoAlerts } from "./seed-demo-conformity";
import { demoRevisionAAlertReason } from "../models/seeders/demo-conformity";

export type Team = Record<DemoRole, DemoApiSession>;
type DeviceReview = { open: CandidateSummary | null; latest: CandidateSummary | null };

/** Signs the organization's engineer and reviewer in once per run. */
export function teams(appUrl: string): (org: string) => Promise<Team> {
  const signedIn = new Map<string, Promise<Team>>();
  const person = (org: string, role: DemoRole) => {
    const user = demoOrganizations.find((o) => o.slug === org)?.users.find((u) => u.role === role);
    if (!user) throw new Error(`the demo organization ${org} has no ${role}`);
    return DemoApiSession.signIn(appUrl, { email: user.email, password: demoPassword });
  };
  return (org) => {
    if (!signedIn.has(org)) signedIn.set(org, Promise.all([person(org, "engineer"), person(org, "reviewer")]).then(([engineer, reviewer]) => ({ engineer, reviewer })));
    return signedIn.get(org)!;
  };
}

export async function deviceIdOf(session: DemoApiSession, part: string): Promise<number> {
  const { devices } = await session.call<{ devices: { id: number; partNumber: string }[] }>("GET", "/api/devices");
  const device = devices.find((d) => d.partNumber === part);
  if (!device) throw new Error(`the demo device ${part} is not there`);
  return device.id;
}

export const revisionLetters = async (session: DemoApiSession, deviceId: number) =>
  (await session.call<{ revisions: RevisionSummary[] }>("GET", `/api/devices/${deviceId}/revisions`)).revisions.map((r) => r.letter);

const deviceReview = (session: DemoApiSession, deviceId: number) => session.call<DeviceReview>("GET", `/api/devices/${deviceId}/review`);

/** Each open issue of the draft with the engineer's reason for letting it stand; an issue the story has no reason for stops the run. */
async function acknowledgements(engineer: DemoApiSession, deviceId: number, reasons: Readonly<Record<string, string>>): Promise<{ issue: string; reason: string }[]> {
  const { sheet } = await engineer.call<{ sheet: SheetModel }>("GET", `/api/devices/${deviceId}/sheet`);
  return sheet.issues.map((issue) => {
    const reason = reasons[issue.code];
    if (!reason) throw new Error(`${sheet.header.partNumber}: the demo has no reason to let the issue "${issue.message}" stand`);
    return { issue: issue.message, reason };
  });
}

/** Submits the draft (a changes-requested candidate is replaced); the one already in review when it is identical. */
async function submitDraft(team: Team, deviceId: number, note: string, issueReasons: Readonly<Record<string, string>> = {}): Promise<number> {
  const body = { acknowledgements: await acknowledgements(team.engineer, deviceId, issueReasons), note };
  const answer = await team.engineer.send<{ candidate: CandidateDetail; error?: { message: string } }>("POST", `/api/devices/${deviceId}/candidates`, body);
  if (answer.status === 201) return answer.body.candidate.id;
  const { open } = await deviceReview(team.engineer, deviceId);
  if (answer.status === 409 && open?.state === "in-review") return open.id;
  throw new Error(`submitting device ${deviceId}: ${answer.status} ${answer.body.error?.message}`);
}

const sign = (reviewer: DemoApiSession, candidateId: number) =>
  reviewer.call("POST", `/api/sheet-candidates/${candidateId}/decision`, { decision: "approve", meaning: "approved-for-release", password: demoPassword }, 200);

const requestChanges = (reviewer: DemoApiSession, candidateId: number, reason: string) =>
  reviewer.call("POST", `/api/sheet-candidates/${candidateId}/decision`, { decision: "request-changes", reason }, 200);

/** Submit, sign and release the draft as the next revision, going on from an approved candidate if there is one. */
export async function releaseNext(
  team: Team,
  deviceId: number,
  notes: { submitNote: string; releaseNote: string; issueReasons?: Readonly<Record<string, string>> },
): Promise<string> {
  const { open } = await deviceReview(team.engineer, deviceId);
  let candidateId = open?.state === "approved" ? open.id : null;
  if (candidateId === null) {
    candidateId = await submitDraft(team, deviceId, notes.submitNote, notes.issueReasons);
    await sign(team.reviewer, candidateId);
  }
  const { revision } = await team.engineer.call<{ revision: RevisionSummary }>("POST", `/api/sheet-candidates/${candidateId}/release`, { note: notes.releaseNote });
  return revision.letter;
}

/** The reviewer approves the device's sets waiting for review that `wanted` picks. */
export async function approveWaiting(reviewer: DemoApiSession, deviceId: number, wanted: (set: MeasurementSetSummary) => boolean): Promise<void> {
  const { measurementSets } = await reviewer.call<{ measurementSets: MeasurementSetSummary[] }>("GET", "/api/measurements/pending");
  for (const set of measurementSets.filter((s) => s.deviceId === deviceId && wanted(s))) {
    await reviewer.call("POST", `/api/measurements/${set.id}/review`, { decision: "approve" }, 200);
  }
}

/** The files the demo has approved before any release (on a database the loader filled before they were, too). */
const approvedBeforeRelease = (part: string) => (set: MeasurementSetSummary) =>
  demoUploads.some((u) => u.part === part && u.file === set.fileName && u.approve && !u.approveAfterRevisionA);

/** The files the demo approves only once revision A is out: BFD-0004 and the runs over temperature. */
const approvedAfterRevisionA = (part: string) => (set: MeasurementSetSummary) =>
  demoUploads.some((u) => u.part === part && u.file === set.fileName && u.approve && u.approveAfterRevisionA);

/** The sheet's limits, words and design-in lists as given, the rest of its content as demo-sheets.ts and demo-design-in.ts have it (the outline drawing stays as uploaded). */
async function putSheet(engineer: DemoApiSession, deviceId: number, part: string, edits: Partial<Pick<DemoSheetContent, "limits" | "prose">> & { designIn?: DemoDesignIn } = {}) {
  const { limits, prose, absoluteMaximumRatings, measurementUncertainty } = { ...demoSheets[part], ...edits };
  await engineer.call("PUT", `/api/devices/${deviceId}/spec-limits`, { limits }, 200);
  await engineer.call("PUT", `/api/devices/${deviceId}/sheet-content`, { prose, absoluteMaximumRatings, measurementUncertainty }, 200);
  const designIn = edits.designIn ?? demoDesignIn[part];
  if (designIn) {
    const { packageOutline, ...lists } = designIn;
    await engineer.call("PUT", `/api/devices/${deviceId}/design-data`, { ...lists, packageOutlineCaption: packageOutline.caption }, 200);
  }
}

/** The demo customer follows the part (201, or 200 when already following), so its next release sends them the change notice. */
async function followAsCustomer(appUrl: string, org: string, part: string, email: string): Promise<void> {
  const customer = await DemoApiSession.signIn(appUrl, { email, password: demoPassword });
  const answer = await customer.send<{ error?: { message: string } }>("POST", "/api/subscriptions", { organization: org, partNumber: part });
  if (answer.status !== 201 && answer.status !== 200) throw new Error(`${email} following ${part}: ${answer.status} ${answer.body?.error?.message}`);
}

/**
 * KDX-2G4: revision A from three units and an 11.5 dB limit; then the demo customer follows the part,
 * the fourth unit, a send-back, the 11.0 dB limit and revision B (whose change notice the customer gets).
 */
async function playDoublerStory(team: Team): Promise<string[]> {
  const story = demoDoublerStory;
  const deviceId = await deviceIdOf(team.engineer, story.part);
  const letters = await revisionLetters(team.engineer, deviceId);
  if (letters.includes("B")) return [];
  const done: string[] = [];
  if (!letters.includes("A")) {
    await approveWaiting(team.reviewer, deviceId, approvedBeforeRelease(story.part));
    await putSheet(team.engineer, deviceId, story.part, { limits: story.limitsAtRevisionA, prose: story.proseAtRevisionA, designIn: story.designInAtRevisionA });
    done.push(`${story.part} ${await releaseNext(team, deviceId, story.revisionA)}`);
  }
  await followAsCustomer(team.engineer.appUrl, story.org, story.part, story.followerBeforeRevisionB);
  await approveWaiting(team.reviewer, deviceId, approvedAfterRevisionA(story.part));
  // The conformity watch flags BFD-0004 against revision A's narrow three-unit charts; the engineer closes it with a reason.
  await closeDemoAlerts(team.engineer, deviceId, demoRevisionAAlertReason);
  if ((await deviceReview(team.engineer, deviceId)).latest?.state === "released") {
    const candidateId = await submitDraft(team, deviceId, story.firstResubmission.note, story.issueReasons);
    await requestChanges(team.reviewer, candidateId, story.firstResubmission.changeRequest);
  }
  await putSheet(team.engineer, deviceId, story.part);
  done.push(`${story.part} ${await releaseNext(team, deviceId, story.revisionB)}`);
  return done;
}

async function playFirstReleases(teamOf: (org: string) => Promise<Team>): Promise<string[]> {
  const done: string[] = [];
  for (const release of demoFirstReleases) {
    const team = await teamOf(release.org);
    const deviceId = await deviceIdOf(team.engineer, release.part);
    if ((await revisionLetters(team.engineer, deviceId)).length > 0) continue;
    await approveWaiting(team.reviewer, deviceId, approvedBeforeRelease(release.part));
    done.push(`${release.part} ${await releaseNext(team, deviceId, release)}`);
  }
  return done;
}

/** WL-C2611-KDX: submitted, the reviewer comments on the conversion-loss row, the engineer replies. */
async function leaveOpenReview(team: Team): Promise<string[]> {
  const story = demoOpenReview;
  const deviceId = await deviceIdOf(team.engineer, story.part);
  if ((await deviceReview(team.engineer, deviceId)).latest) return [];
  const candidateId = await submitDraft(team, deviceId, story.submitNote, story.issueReasons);
  const { candidate } = await team.reviewer.call<{ candidate: CandidateDetail }>("GET", `/api/sheet-candidates/${candidateId}`);
  const row = candidate.model.specifications.rows.find((r) => r.parameter === story.comment.parameter);
  if (!row) throw new Error(`${story.part} has no ${story.comment.parameter} row to comment on`);
  const path = `/api/sheet-candidates/${candidateId}/comments`;
  const { comments } = await team.reviewer.call<{ comments: CandidateDetail["comments"] }>("POST", path, { anchor: { kind: "row", id: row.groupId }, body: story.comment.body });
  const thread = comments.find((c) => c.parentId === null && c.body === story.comment.body)!;
  await team.engineer.call("POST", path, { anchor: { kind: "row", id: row.groupId }, body: story.reply, parentId: thread.id });
  return [`${story.part} in review with a comment thread`];
}

/** PX-40: submitted before any data, sent back by the reviewer with the reason. */
async function leaveChangesRequested(team: Team): Promise<string[]> {
  const story = demoChangesRequested;
  const deviceId = await deviceIdOf(team.engineer, story.part);
  if ((await deviceReview(team.engineer, deviceId)).latest) return [];
  await requestChanges(team.reviewer, await submitDraft(team, deviceId, story.submitNote, story.issueReasons), story.reason);
  return [`${story.part} sent back with changes requested`];
}

/** Plays whatever part of the story the database does not show yet; what it did, one line each. */
export async function seedDemoReleases(appUrl: string): Promise<string[]> {
  const teamOf = teams(appUrl);
  return [
    ...(await playDoublerStory(await teamOf(demoDoublerStory.org))),
    ...(await playFirstReleases(teamOf)),
    ...(await leaveOpenReview(await teamOf(demoOpenReview.org))),
    ...(await leaveChangesRequested(await teamOf(demoChangesRequested.org))),
  ];
}
