import { expect } from "vitest";
import type { CandidateDetail, RevisionSummary } from "@/lib/domain/reviews";
import type { SheetModel } from "@/lib/sheet";
import type { TestClient } from "./client";
import { factoryPassword, makeDevice } from "./factories";
import { fixtureUpload } from "./uploads";

/** A device of the organization with one approved doubler drive sweep: uploaded by the engineer, approved by the reviewer. */
export async function deviceWithApprovedData(organizationId: number, engineer: TestClient, reviewer: TestClient, fixture = "examples/drive-sweep-doubler.csv"): Promise<number> {
  const deviceId = (await makeDevice(organizationId)).id;
  await addApprovedSet(deviceId, engineer, reviewer, fixture);
  return deviceId;
}

export async function addApprovedSet(deviceId: number, engineer: TestClient, reviewer: TestClient, fixture = "examples/drive-sweep-doubler.csv", fields: Record<string, string> = {}): Promise<number> {
  const upload = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload(fixture, fields) });
  expect(upload.status, await upload.clone().text()).toBe(201);
  const setId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
  const review = await reviewer.request(`/api/measurements/${setId}/review`, { json: { decision: "approve" } });
  expect(review.status, await review.clone().text()).toBe(200);
  return setId;
}

/** The draft's open issues, each acknowledged with a reason: what a submission of the sheet as it stands needs. */
export async function acknowledgeAll(engineer: TestClient, deviceId: number): Promise<{ issue: string; reason: string }[]> {
  const r = await engineer.request(`/api/devices/${deviceId}/sheet`);
  expect(r.status).toBe(200);
  const { sheet } = (await r.json()) as { sheet: SheetModel };
  return sheet.issues.map((i) => ({ issue: i.message, reason: "Acknowledged for the test: stands as stated." }));
}

export function submit(engineer: TestClient, deviceId: number, body: unknown): Promise<Response> {
  return engineer.request(`/api/devices/${deviceId}/candidates`, { json: body });
}

/** Submits the draft with every issue acknowledged; the candidate. */
export async function submitDraft(engineer: TestClient, deviceId: number, note = ""): Promise<CandidateDetail> {
  const r = await submit(engineer, deviceId, { acknowledgements: await acknowledgeAll(engineer, deviceId), note });
  expect(r.status, await r.clone().text()).toBe(201);
  return ((await r.json()) as { candidate: CandidateDetail }).candidate;
}

export function sign(reviewer: TestClient, candidateId: number, password = factoryPassword): Promise<Response> {
  return reviewer.request(`/api/sheet-candidates/${candidateId}/decision`, { json: { decision: "approve", meaning: "approved-for-release", password } });
}

export function requestChanges(reviewer: TestClient, candidateId: number, reason = "Tighten the conversion-loss limit, please."): Promise<Response> {
  return reviewer.request(`/api/sheet-candidates/${candidateId}/decision`, { json: { decision: "request-changes", reason } });
}

export function release(engineer: TestClient, candidateId: number, note = ""): Promise<Response> {
  return engineer.request(`/api/sheet-candidates/${candidateId}/release`, { json: { note } });
}

/** Submit → sign → release over HTTP; the released revision. */
export async function releaseSheet(engineer: TestClient, reviewer: TestClient, deviceId: number, note = ""): Promise<RevisionSummary> {
  const candidate = await submitDraft(engineer, deviceId);
  const signed = await sign(reviewer, candidate.id);
  expect(signed.status, await signed.clone().text()).toBe(200);
  const released = await release(engineer, candidate.id, note);
  expect(released.status, await released.clone().text()).toBe(201);
  return ((await released.json()) as { revision: RevisionSummary }).revision;
}

/**
 * A device of the organization released twice: A from its first approved set, then B once a second
 * unit's set is approved. The part number is the one in the public address.
 */
export async function releaseTwoRevisions(
  organizationId: number,
  engineer: TestClient,
  reviewer: TestClient,
): Promise<{ deviceId: number; partNumber: string; revA: RevisionSummary; revB: RevisionSummary }> {
  const deviceId = await deviceWithApprovedData(organizationId, engineer, reviewer);
  const revA = await releaseSheet(engineer, reviewer, deviceId, "First lot.");
  const partNumber = decodeURIComponent(revA.publicPath.split("/")[3]);
  await addApprovedSet(deviceId, engineer, reviewer, "docs/drive-sweep-doubler-unit-6.csv");
  const revB = await releaseSheet(engineer, reviewer, deviceId, "Second lot added.");
  return { deviceId, partNumber, revA, revB };
}
