export * from "./cutout-config";
export * from "./cutout";
