export * from "./byte-size";
export * from "./log-mapping";
export * from "./parse-number";
export * from "./parse-timestamp";
export * from "./read-log-table";
export * from "./guess-mapping";
export * from "./map-log";
export * from "./import-log";
