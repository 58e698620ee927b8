import "server-only";
import type { SheetModel } from "@/lib/sheet";
import { describeSheetChange } from "./describe-change";

/** Release notes: what changed since the previous revision, then the engineer's own note. */
export function releaseNotesFor(previous: SheetModel | null, next: SheetModel, engineerNote: string): string[] {
  const generated = previous ? describeSheetChange(previous, next).map((line) => `Changed: ${line}.`) : ["First release."];
  return engineerNote.trim() ? [...generated, engineerNote.trim()] : generated;
}
