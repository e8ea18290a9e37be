// ESLint for the whole repository: the recommended JavaScript and TypeScript rules, the rules of hooks for the client,
// and the import boundaries of STYLE.md, written as no-restricted-imports per group of files. Prettier owns
// formatting (eslint-config-prettier switches off every rule it would fight with); `npm run lint` runs both.
//
// The boundaries:
//   shared/         imports nothing from server/ or src/
//   shared/engine   imports no zod, no Node modules, no React/Express/Knex, no generator of its own randomness,
//                   and reads no clock; its folders are layered (engineLayers below): a folder imports only folders
//                   of lower rows, and only through their index.ts (tests may look inside and cross-check upwards)
//   src/, server/   never import each other
//   src/features    a feature imports another only through its public index.ts (@/features/<name>)
//   src/components, src/lib   know no feature and no route module
import js from "@eslint/js";
import { defineConfig, globalIgnores } from "eslint/config";
import prettier from "eslint-config-prettier";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import { readdirSync } from "node:fs";
import { builtinModules } from "node:module";
import tseslint from "typescript-eslint";

/** Engine folders, lowest first. A folder missing here (a new one) counts as the top row until it is placed. */
const engineLayers = [
  ["bits"],
  ["network"],
  ["rules", "automata", "update", "structure", "perturbation", "certificates"],
  ["generators", "state-graph", "emulation", "block-emulation", "sat"],
  ["coarse-graining", "embedding", "ensembles", "phenotype", "trap-spaces"],
  ["elimination", "expectations"],
  ["screens"],
];

const subfolders = (dir) =>
  readdirSync(new URL(dir, import.meta.url), { withFileTypes: true })
    .filter((d) => d.isDirectory())
    .map((d) => d.name);
const engineFolders = subfolders("./shared/engine/");
const features = subfolders("./src/features/");
const rankOf = (folder) => {
  const row = engineLayers.findIndex((names) => names.includes(folder));
  return row < 0 ? engineLayers.length : row;
};

const escape = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const up = (n) => `(?:\\.\\./){${n}}`;
const pattern = (regex, message) => ({ regex, message });
/** Source and test files at `depth` folders below `dir` (depth 0: dir/*.ts). */
const filesAt = (dir, depth) => [`${dir}/${"*/".repeat(depth)}*.{ts,tsx}`];
const DEPTHS = [0, 1, 2];
const tests = ["**/*.test.ts", "**/*.test.tsx", "**/*.test-support.ts"];

const notServer = pattern("^(?:\\.\\./)+server(?:/|$)", "The client never imports server code; share it in shared/.");
const notSrc = [
  pattern("^@/", "The server never imports client code; share it in shared/."),
  pattern("^(?:\\.\\./)+src(?:/|$)", "The server never imports client code; share it in shared/."),
];
const sharedOnly = [
  pattern("^@/", "shared/ imports nothing from src/."),
  pattern("^(?:\\.\\./)+(?:server|src)(?:/|$)", "shared/ imports nothing from server/ or src/."),
];
const engineNever = (message) => [
  pattern("^zod$", `The engine takes checked values; validation with zod belongs to shared/schemas. ${message}`),
  pattern("^(?:react|react-dom|express|knex|pg|pg-boss|piscina|pino|multer)(?:/|$)", `The engine is pure. ${message}`),
];
const enginePure = [
  ...engineNever(""),
  pattern(
    `^(?:node:.*|${builtinModules.map(escape).join("|")})$`,
    "The engine does no I/O and uses no Node API, so it runs in a worker thread and in the browser alike.",
  ),
  pattern("^seedrandom$", "The engine draws randomness from a seeded generator passed in as an argument."),
];
const noClock = [
  { object: "Math", property: "random", message: "Take a seeded generator as an argument." },
  { object: "Date", property: "now", message: "The engine reads no clock; results must be reproducible." },
  { object: "performance", property: "now", message: "The engine reads no clock; results must be reproducible." },
];

/** What an engine source file at `depth` inside `folder` (null: the engine's root files) may not import. */
function engineBoundaries(folder, depth) {
  const toEngineRoot = folder === null ? 0 : depth + 1;
  const out = [
    ...sharedOnly,
    ...enginePure,
    pattern(`^${up(toEngineRoot + 1)}`, "The engine imports nothing outside shared/engine."),
    pattern("^@shared/(?!engine(?:/|$))", "The engine imports nothing outside shared/engine."),
  ];
  if (folder === null) return out;
  const others = engineFolders.filter((f) => f !== folder);
  const higher = others.filter((f) => rankOf(f) >= rankOf(folder));
  out.push(
    pattern(
      `^${up(toEngineRoot)}(?!(?:\\.\\./))[^/]+/.`,
      "Import another engine folder through its index.ts (../folder), not a file inside it.",
    ),
    pattern("^@shared/engine/[^/]+/.", "Import another engine folder through its index.ts, not a file inside it."),
  );
  if (higher.length) {
    const names = higher.map(escape).join("|");
    const lower = engineFolders.filter((f) => rankOf(f) < rankOf(folder));
    const message =
      `Lower engine folders never import higher ones: ${folder} may import ${lower.length ? lower.join(", ") : "no other folder"} ` +
      "(engineLayers in eslint.config.js).";
    out.push(
      pattern(`^${up(toEngineRoot)}(?:${names})(?:/|$)`, message),
      pattern(`^@shared/engine/(?:${names})(?:/|$)`, message),
    );
  }
  return out;
}

/** What a file at `depth` inside src/features/`feature` may not import. */
function featureBoundaries(feature, depth) {
  return [
    notServer,
    pattern("^@/app(?:/|$)", "Features do not import route modules; routes compose features."),
    pattern(
      `^@/features/(?!${escape(feature)}(?:/|$))[^/]+/.`,
      "Import another feature only through its public index.ts: @/features/<name>.",
    ),
    pattern(
      `^${up(depth + 1)}`,
      "Leave a feature through an alias: @/features/<name> for another feature, @/components or @/lib for the rest.",
    ),
  ];
}

const restrict = (files, patterns, ignores = []) => ({
  files,
  ignores,
  rules: { "no-restricted-imports": ["error", { patterns }] },
});

const clientLayers = [
  pattern("^@/features(?:/|$)", "Shared UI and lib know no feature; pass what they need in as props or slots."),
  pattern("^@/app(?:/|$)", "Shared UI and lib know no route module."),
];

export default defineConfig(
  globalIgnores(["dist/", ".data/", ".test-data/", ".tmp/", "tests/e2e/screenshots/", "test-report.json"]),
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    rules: {
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrors: "none", ignoreRestSiblings: true },
      ],
    },
  },
  // Declaration files describe a library's API; a class there may be named only to type its constructor.
  { files: ["**/*.d.ts"], rules: { "@typescript-eslint/no-unused-vars": "off" } },
  // The engine's hot loops write two updates in one loop body as a comma sequence, on purpose.
  { files: ["shared/engine/**", "shared/formats/**"], rules: { "@typescript-eslint/no-unused-expressions": "off" } },
  { files: ["src/**/*.{ts,tsx}"], ...reactHooks.configs.flat["recommended-latest"] },
  { files: ["src/**/*.{ts,tsx}"], languageOptions: { globals: globals.browser } },
  {
    files: ["server/**", "tests/**", "seeds/**", "migrations/**", "scripts/**", "*.{js,ts}", "shared/**/*.test.ts"],
    languageOptions: { globals: globals.node },
  },

  // Import boundaries: each file falls in exactly one of these groups, so each carries its whole list.
  restrict(["server/**/*.ts"], notSrc),
  restrict(["src/**/*.{ts,tsx}"], [notServer], ["src/features/**", "src/components/**", "src/lib/**"]),
  restrict(["src/components/**/*.{ts,tsx}"], [notServer, ...clientLayers]),
  restrict(
    ["src/lib/**/*.{ts,tsx}"],
    [notServer, ...clientLayers, pattern("^@/components(?:/|$)", "lib is below the shared UI.")],
  ),
  ...features.flatMap((f) => DEPTHS.map((d) => restrict(filesAt(`src/features/${f}`, d), featureBoundaries(f, d)))),
  restrict(["shared/**/*.ts"], sharedOnly, ["shared/engine/**"]),
  restrict(filesAt("shared/engine", 0), engineBoundaries(null, 0), tests),
  ...engineFolders.flatMap((f) =>
    DEPTHS.map((d) => restrict(filesAt(`shared/engine/${f}`, d), engineBoundaries(f, d), tests)),
  ),
  restrict(
    tests.map((t) => `shared/engine/${t}`),
    [...sharedOnly, ...engineNever("Engine tests check the engine alone.")],
  ),
  {
    files: ["shared/engine/**/*.ts"],
    ignores: tests,
    rules: { "no-restricted-properties": ["error", ...noClock] },
  },

  prettier,
);
