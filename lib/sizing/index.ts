export * from "./laws";
export * from "./fit";
export * from "./rounding";
export * from "./stent";
export * from "./axis";
export * from "./grid";
export * from "./format";
