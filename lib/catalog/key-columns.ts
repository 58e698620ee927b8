/**
 * The figures the catalog's result table shows for each device class: what an RF designer
 * compares first. Each names a searchable parameter (lib/catalog/catalog-query.ts) and the limit
 * that guarantees it (the highest max, or the lowest min, over the sheet's condition groups),
 * shown beside the typical value.
 */
import type { DeviceClass } from "../domain/device-classes";

export type KeyColumn = { key: string; symbol: string; guarantee: "min" | "max" };

export const catalogKeyColumns: Record<DeviceClass, KeyColumn[]> = {
  "frequency-multiplier": [
    { key: "conversion-loss", symbol: "CL", guarantee: "max" },
    { key: "fundamental-suppression", symbol: "HS1", guarantee: "min" },
    { key: "third-harmonic-suppression", symbol: "HS3", guarantee: "min" },
    { key: "input-p1db", symbol: "P1dB", guarantee: "min" },
  ],
  "double-balanced-mixer": [
    { key: "conversion-loss", symbol: "CL", guarantee: "max" },
    { key: "isolation-lo-rf", symbol: "ISO LO-RF", guarantee: "min" },
    { key: "iip3", symbol: "IIP3", guarantee: "min" },
    { key: "input-p1db", symbol: "P1dB", guarantee: "min" },
  ],
  "quadrature-hybrid": [
    { key: "insertion-loss", symbol: "IL", guarantee: "max" },
    { key: "amplitude-balance", symbol: "Amp. bal.", guarantee: "max" },
    { key: "phase-balance", symbol: "Phase bal.", guarantee: "max" },
    { key: "vswr", symbol: "VSWR", guarantee: "max" },
  ],
  "comb-generator-test-only": [{ key: "conversion-loss", symbol: "CL", guarantee: "max" }],
};
