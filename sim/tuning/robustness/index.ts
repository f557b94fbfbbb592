export * from "./loop";
export * from "./frequency-response";

export * from "./margins";
export * from "./assessment";
