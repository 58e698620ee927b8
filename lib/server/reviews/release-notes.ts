import "server-only";
import type { SheetModel } from "@/lib/sheet";
import { describeSheetChange } from "./describe-change";

/** Release notes: what changed since the previous revision (generated from the diff; "First release." for A), then the engineer's own note. */
export function releaseNotesFor(previous: SheetModel | null, next: SheetModel, engineerNote: string): string[] {
  const generated = describeSheetChange(previous, next);
  return engineerNote.trim() ? [...generated, engineerNote.trim()] : generated;
}
