export * from "./types";
export * from "./policies";
