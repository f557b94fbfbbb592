export * from "./describing-function";
export * from "./fopdt-relations";
export * from "./relay-test";
