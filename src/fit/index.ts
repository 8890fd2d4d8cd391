// Fits of surplus growth laws: rows in, fit objects out (intervals, tests, bands, tables).
export * from "./student-t.js";
export * from "./least-squares.js";
export * from "./bootstrap.js";
export * from "./rows.js";
export * from "./types.js";
export * from "./options.js";
export * from "./laws.js";
export * from "./model.js";
export * from "./power-law.js";
export * from "./constant.js";
export * from "./band.js";
export * from "./by-family.js";
export * from "./format.js";
