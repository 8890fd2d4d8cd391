// Exporters: standalone HTML and the report page, SVG/PNG/PDF through headless Chromium,
// pgfplots for papers, CSV of the plotted data, and a batch writer.
export * from "./html.js";
export * from "./report.js";
export * from "./chromium.js";
export * from "./pgfplots.js";
export * from "./csv.js";
export * from "./files.js";
