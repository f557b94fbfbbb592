export * from "./experiment-drill";
export * from "./variants";
export * from "./sweep";
export * from "./tuning-map";
