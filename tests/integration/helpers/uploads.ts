import { db } from "@/models";
import { readFileSync } from "node:fs";
import path from "node:path";

export const fixturesDir = path.resolve(__dirname, "../../../fixtures");

/** A multipart body with one fixture file and condition fields, as the upload form sends it. */
export function fixtureUpload(relative: string, fields: Record<string, string> = {}, bytes?: Uint8Array<ArrayBuffer>): FormData {
  const form = new FormData();
  const data = bytes ?? new Uint8Array(readFileSync(path.join(fixturesDir, relative)));
  form.set("file", new Blob([data]), path.basename(relative));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return form;
}

/** How many measurement sets and stored files exist: compared before and after a refused upload. */
export async function uploadRowCounts(): Promise<{ sets: number; files: number }> {
  const { MeasurementSet, StoredFile } = db();
  return { sets: await MeasurementSet.count(), files: await StoredFile.count() };
}
