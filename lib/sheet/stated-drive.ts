import type { SpecRowTemplate } from "../../templates/types";

/** A specification row or a trend chart that may be held at a stated drive. */
type AtStatedDrive = Pick<SpecRowTemplate, "id" | "parameter" | "match" | "atStatedDrive">;
import type { DerivedParameter } from "../analysis/types";
import { interpolate, mergeRepeatedX } from "./curve-overlay";
import type { ApprovedSetInput } from "./types";

/** A unit whose stored sweep does not reach the row's stated drive: named in the sheet's open issues. */
export interface StatedDriveMiss {
  rowId: string;
  serial: string;
  setId: string;
  driveDbm: number;
  sweep: { min: number; max: number } | null;
}

/**
 * A row held at a drive the template states (SpecRowTemplate.atStatedDrive): each of the set's per-unit
 * figures at its optimum drive (conditions `drive: "optimum"`) read again at the stated per-port drive,
 * off the set's stored curve against per-port drive, by linear interpolation in dB between the two
 * measured steps around it. De-embedding puts every unit's steps at its own per-port drives, so the
 * nearest step would state each unit at a slightly different drive. Nothing is extrapolated: a sweep
 * that does not reach the drive gives no value and a miss.
 */
export function readAtStatedDrive(row: AtStatedDrive, set: Pick<ApprovedSetInput, "id" | "serial" | "parameters" | "curves">): { parameters: DerivedParameter[]; misses: StatedDriveMiss[] } {
  const at = row.atStatedDrive;
  const driveDbm = row.match?.drive;
  if (!at || typeof driveDbm !== "number") return { parameters: [], misses: [] };
  const curve = set.curves.find((c) => c.id === at.curveId);
  const series = curve ? (at.series === undefined ? curve.series[0] : curve.series.find((s) => s.name === at.series)) : undefined;
  const points = series ? mergeRepeatedX(series.points.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y))) : [];
  const parameters: DerivedParameter[] = [];
  const misses: StatedDriveMiss[] = [];
  for (const parameter of set.parameters) {
    if (parameter.name !== row.parameter || parameter.conditions.drive !== "optimum") continue;
    const others = Object.entries(row.match ?? {}).filter(([key]) => key !== "drive");
    if (!others.every(([key, value]) => parameter.conditions[key] === value)) continue;
    const value = points.length > 0 ? interpolate(points, driveDbm, (x) => x) : null;
    if (value === null) {
      misses.push({
        rowId: row.id,
        serial: set.serial,
        setId: String(set.id),
        driveDbm,
        sweep: points.length > 0 ? { min: points[0][0], max: points[points.length - 1][0] } : null,
      });
      continue;
    }
    parameters.push({ ...parameter, value, conditions: { ...parameter.conditions, drive: driveDbm } });
  }
  return { parameters, misses };
}
