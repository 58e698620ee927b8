/**
 * The figures the catalog's result table shows for each device class: what an RF designer
 * compares first. Each names a searchable parameter (lib/catalog/catalog-query.ts) and the limit
 * that guarantees it (the highest max, or the lowest min, over the sheet's condition groups),
 * shown beside the typical value. The column's name and symbol are the template row's
 * (catalogParameters: lib/domain/parameter-names.ts), never typed here.
 */
import type { DeviceClass } from "../domain/device-classes";
import { catalogParameters } from "./catalog-query";

export type KeyColumn = { key: string; guarantee: "min" | "max" };

export const catalogKeyColumns: Record<DeviceClass, KeyColumn[]> = {
  "frequency-multiplier": [
    { key: "conversion-loss", guarantee: "max" },
    { key: "fundamental-suppression", guarantee: "min" },
    { key: "third-harmonic-suppression", guarantee: "min" },
    { key: "input-p1db", guarantee: "min" },
  ],
  "double-balanced-mixer": [
    { key: "conversion-loss", guarantee: "max" },
    { key: "isolation-lo-rf", guarantee: "min" },
    { key: "iip3", guarantee: "min" },
    { key: "input-p1db", guarantee: "min" },
  ],
  "quadrature-hybrid": [
    { key: "insertion-loss", guarantee: "max" },
    { key: "amplitude-balance", guarantee: "max" },
    { key: "phase-balance", guarantee: "max" },
    { key: "vswr", guarantee: "max" },
  ],
  "comb-generator-test-only": [{ key: "conversion-loss", guarantee: "max" }],
};

/** A key column's head: the symbol the sheet prints for it, and its name (for the abbreviation's title). */
export function keyColumnHead(key: string): { symbol: string; name: string } {
  const parameter = catalogParameters().get(key);
  return { symbol: parameter?.symbol ?? key, name: parameter?.label ?? key };
}
