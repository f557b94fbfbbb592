/**
 * Loopwright's tuning toolkit: tuning rules and form conversion, robustness of a loop, bump-test
 * identification, the relay and bump tests on the engine, and the power curve.
 */
export * from "./models";
export * from "./model-definition";
export * from "./rules";
export * from "./robustness";
export * from "./identify";
export * from "./relay";
export * from "./bump";
export * from "./numeric";
export * from "./power-curve";
export * from "./proposal";
