export * from "./common";
export * from "./auth";
export * from "./team";
export * from "./projects";
export * from "./outbox";
