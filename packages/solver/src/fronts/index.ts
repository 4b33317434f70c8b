// Several fronts, one budget: public API of the fronts model.
export * from "./types";
export * from "./validateFronts";
export * from "./normalizeFronts";
export * from "./frontPayoff";
export * from "./waterFilling";
export * from "./allPayAllocation";
export * from "./bestAllocation";
export * from "./frontsEquilibrium";
export * from "./frontsReading";
export * from "./frontsSweep";
