// One zod schema per record, shared by the forms, the API and the sync path.
export * from "./mix-design";
export * from "./placement";
export * from "./delivery";
export * from "./field-test";
export * from "./specimens";
export * from "./weather";
export * from "./checklist";
export * from "./curing";
export * from "./diary";
export * from "./site-visits";
export * from "./photo";
export * from "./maturity";
