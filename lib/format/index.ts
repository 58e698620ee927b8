export * from "./quantity";
export * from "./date";
export * from "./byte-size";
export * from "./typed-decimals";
export * from "./text";
