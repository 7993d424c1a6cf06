export * from "./auth";
export * from "./audit";
