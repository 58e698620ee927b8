import "server-only";
import { createHash } from "node:crypto";
import type { Transaction } from "sequelize";
import { buildSheetModel, serializeSheetModel, type SheetModel } from "@/lib/sheet";
import { db } from "@/models";
import { loadSheetInput } from "../sheets/load-sheet-input";

/** SHA-256 (hex) of a sheet model's stable JSON: what a signature names and an ETag carries. */
export function modelDigest(json: string): string {
  return createHash("sha256").update(json).digest("hex");
}

export type FrozenModel = { model: SheetModel; json: string; digest: string };

/**
 * The sheet of a device as a candidate for review, dated `date`: the draft's data, limits and
 * prose, in state "in review", with the history of the revisions released so far. Submission
 * freezes it; the freshness check builds it again with the same date and compares digests, so
 * any change to what the sheet shows (and nothing else) makes a candidate stale.
 */
export async function buildCandidateModel(opts: { organizationId: number; deviceId: number; date: string; transaction?: Transaction }): Promise<FrozenModel> {
  const { SheetRevision } = db();
  const released = await SheetRevision.findAll({
    where: { deviceId: opts.deviceId, organizationId: opts.organizationId },
    attributes: ["letter", "releasedAt", "releaseNotes"],
    order: [["sequence", "ASC"]],
    transaction: opts.transaction,
  });
  const history = released.map((r) => ({ label: r.letter, date: r.releasedAt.toISOString().slice(0, 10), summary: historySummary(r.releaseNotes) }));
  const input = await loadSheetInput({ ...opts, revision: { label: null, state: "in-review", history } });
  const model = buildSheetModel(input);
  const json = serializeSheetModel(model);
  return { model, json, digest: modelDigest(json) };
}

/** One line of a revision's notes for the history table: the first note, shortened. */
export function historySummary(notes: string[]): string {
  const first = notes[0] ?? "Released.";
  return first.length > 160 ? `${first.slice(0, 157)}…` : first;
}
