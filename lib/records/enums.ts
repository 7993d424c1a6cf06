// The value lists live beside the tables that constrain them (db/schema/enums.ts); lib and the
// screens read them here, so nothing outside db/ depends on the schema folder's layout.
export * from "@/db/schema/enums";
