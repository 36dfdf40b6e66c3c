export * from "./dealerships.ts";
export * from "./users.ts";
export * from "./sessions.ts";
export * from "./audit-log.ts";
export * from "./rate-limits.ts";
export * from "./vehicles.ts";
export * from "./vehicle-events.ts";
