/**
 * What the catalog's search index holds of one released revision, read from its frozen sheet model
 * (pure): one entry per specification row and condition group, limits in the row's own unit.
 */
import type { SheetModel } from "../sheet/types";

export type ReleasedSpecValue = {
  rowId: string;
  parameter: string;
  conditionsKey: string;
  min: number | null;
  typ: number | null;
  max: number | null;
  unit: string;
};

export function releasedSpecValues(model: SheetModel): ReleasedSpecValue[] {
  return model.specifications.rows.map((row) => ({
    rowId: row.rowId,
    parameter: row.parameter,
    conditionsKey: row.conditionsKey,
    min: finiteOrNull(row.min.value),
    typ: finiteOrNull(row.typ.value),
    max: finiteOrNull(row.max.value),
    unit: row.unit,
  }));
}

function finiteOrNull(value: number | null): number | null {
  return value !== null && Number.isFinite(value) ? value : null;
}
