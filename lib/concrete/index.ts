// Pure concrete calculations for the field and office screens; no React, Next or database here.
export * from "./errors";
export * from "./units";
export * from "./psychro";
export * from "./evaporation";
export * from "./cold-weather";
export * from "./discharge-temperature";
export * from "./delivery";
export * from "./tolerance";
export * from "./yield";
export * from "./strength";
export * from "./maturity";
export * from "./maturity-calibration";
export * from "./maturity-record";
export * from "./maturity-interval";
export * from "./maturity-assessment";
