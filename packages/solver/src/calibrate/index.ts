export * from "./types";
export * from "./panelCsv";
export * from "./panel";
export * from "./calibrate";
export * from "./calibratedScenario";
export * from "./studentT";
export { sortedQuantile } from "./revealedValues";
export * from "./demoPanel";
export * from "./provenance";
