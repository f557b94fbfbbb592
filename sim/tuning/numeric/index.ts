export * from "./one-dimensional-search";
export * from "./nelder-mead";
