/**
 * Loopwright simulation engine — public exports. Pure TypeScript: no React, DOM or Node imports
 * (sim/cli and sim/perf wrap it for Node).
 */
export { ENGINE_VERSION } from "./version";
export * from "./plant";
export * from "./actuator";
export * from "./safety";
export * from "./drill";
export * from "./random";
export * from "./sensor";
export * from "./control";
export * from "./results";
export * from "./units";
export * from "./tuning/rules";
