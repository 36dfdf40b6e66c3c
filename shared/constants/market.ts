export const MARKET_CODES = ["AU", "NZ", "UK", "EU", "US", "CA_ON", "CA_QC"] as const;
export type MarketCode = (typeof MARKET_CODES)[number];
export const DISTANCE_UNITS = ["km", "mi"] as const;
export type DistanceUnit = (typeof DISTANCE_UNITS)[number];
