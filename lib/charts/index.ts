export * from "./styles";
export * from "./build-vega-lite-spec";
export * from "./curve-chart-spec";
