export * from "./comparativeStatics";
export * from "./hillmanRileyStatics";
export * from "./richardson";
