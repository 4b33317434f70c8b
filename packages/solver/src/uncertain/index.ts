export * from "./types";
export * from "./dist";
export * from "./validateUncertain";
export * from "./stats";
export * from "./draws";
export * from "./tornado";
export * from "./robustPlan";
export * from "./monteCarlo";
