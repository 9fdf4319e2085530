export * from "./enums";
export * from "./organisations";
export * from "./sites";
export * from "./months";
export * from "./audit";
export * from "./capture";
export * from "./statements";
export * from "./snapshots";
