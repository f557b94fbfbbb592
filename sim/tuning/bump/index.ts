export * from "./bump-test";
