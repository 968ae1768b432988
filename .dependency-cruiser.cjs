/**
 * Stoke's layer check (npm run lint:layers). lib/ reads top-down:
 *   units, errors, formats → schemas → thermo → fuels → combustion → flame → plant → economics → study → services
 * with lib/db beside (database access and row mapping only; lib/services is the first layer that may
 * use it) and lib/cli on top.
 * A module may import its own layer and the layers listed before it, never one after it; with
 * lib/db, lib/cli and app/ held to their own rules below, no two folders of lib/ can form a cycle.
 */
const LAYERS = [
  "units",
  "errors",
  "formats",
  "schemas",
  "thermo",
  "fuels",
  "combustion",
  "flame",
  "plant",
  "economics",
  "study",
  "services",
  "cli",
];
const layerPath = (name) => (name === "errors" ? "^lib/errors\\.ts$" : `^lib/${name}/`);

const higherThan = (i) =>
  LAYERS.slice(i + 1)
    .map(layerPath)
    .join("|");

/** The first layer that may read and write the database (through lib/db). */
const DB_FROM = LAYERS.indexOf("services");

const layerRules = LAYERS.slice(0, -1).map((name, i) => ({
  name: `layer-${name}`,
  comment: `lib/${name} may not import a higher layer (${LAYERS.slice(i + 1).join(", ")})${i < DB_FROM ? " or the database module" : ""}`,
  severity: "error",
  from: { path: layerPath(name) },
  to: { path: i < DB_FROM ? `${higherThan(i)}|^lib/db/` : higherThan(i) },
}));

module.exports = {
  forbidden: [
    ...layerRules,
    {
      name: "db-maps-rows-only",
      comment: "lib/db holds database access and row mapping: it may import schemas, units and errors, nothing that computes",
      severity: "error",
      from: { path: "^lib/db/" },
      to: { path: "^lib/", pathNot: "^lib/(db|schemas|units)/|^lib/errors\\.ts$" },
    },
    {
      name: "no-ui-or-orm-in-lib",
      comment: "no React, Next or Prisma in lib/ outside the database module",
      severity: "error",
      from: { path: "^lib/", pathNot: "^lib/db/" },
      to: { path: "node_modules/(react|react-dom|next|@prisma|prisma|better-sqlite3|pg)/|^lib/db/generated(-pg)?/" },
    },
    {
      name: "app-through-services",
      comment: "pages and route handlers reach the database through lib/services (lib/db/client for the connection only)",
      severity: "error",
      from: { path: "^app/" },
      to: { path: "^lib/db/", pathNot: "^lib/db/client\\.ts$" },
    },
    {
      name: "no-circular",
      comment: "no import cycles",
      severity: "error",
      from: { path: "^(lib|app)/" },
      to: { circular: true },
    },
  ],
  options: {
    // The generated Prisma client is a node (so that importing it outside lib/db is caught) but is not cruised.
    doNotFollow: { path: "node_modules|^lib/db/generated(-pg)?/" },
    exclude: { path: "\\.next/" },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: "tsconfig.json" },
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default"],
      extensions: [".ts", ".tsx", ".js", ".mjs", ".cjs", ".json"],
    },
    reporterOptions: { text: { highlightFocused: true } },
  },
};
