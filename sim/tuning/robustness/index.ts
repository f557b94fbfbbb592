export * from "./loop";
export * from "./frequency-response";
export * from "./search";
export * from "./margins";
export * from "./assessment";
