export * from "./params";
export * from "./point";
export * from "./plan";
export * from "./sweep1d";
export * from "./sweep2d";
