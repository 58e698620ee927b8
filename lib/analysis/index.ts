export * from "./types";
export * from "./catalog";
export { decimateSeries, DEFAULT_MAX_CURVE_POINTS } from "./curves";
export { deriveParameters } from "./derive-parameters";
export { DEFAULT_HYBRID_PORTS, DEFAULT_SPLITTER_PORTS } from "./touchstone";
export { DEFAULT_INTEGRATION_START_HZ, DEFAULT_INTEGRATION_STOP_HZ } from "./phase-noise";
export * from "./cli-args";
export * from "./format-table";
