export * from "./version";
export * from "./units";
export * from "./schema";
export * from "./types";
