// The public surface of the domain layer.
export * from "./guards.ts";
export * from "./calendar.ts";
export * from "./units.ts";
export * from "./fuel.ts";
export * from "./range.ts";
export * from "./co2.ts";
export * from "./power.ts";
export * from "./vin.ts";
export * from "./service.ts";
export * from "./tyre-tables.ts";
export * from "./tyres.ts";
export * from "./markets.ts";
export * from "./condition-index.ts";
export * from "./display.ts";
export * from "./derived.ts";
