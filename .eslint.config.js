// One lint config for the whole project. Besides the usual TypeScript and React hook rules it
// enforces the import direction (see DEVELOPERS.md, "Boundaries").
import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import importX from "eslint-plugin-import-x";
import prettierConfig from "eslint-config-prettier";
import path from "node:path";

const root = import.meta.dirname;

/** [importing folder, forbidden target folders, reason] — folders relative to the project root. */
const BOUNDARIES = [
  ["shared", ["src", "server", "migrations", "seeders", "tests"], "shared/ is pure domain code used by both sides"],
  ["src", ["server", "migrations", "seeders"], "the client never imports server code; share it through shared/"],
  [
    "src/features",
    ["src/app"],
    "features do not know the app shell; an organisation's page gets its org from useOrganisation() in src/lib",
  ],
  ["src/components", ["src/features", "src/app"], "shared components sit below the features"],
  ["src/lib", ["src/features", "src/app"], "shared client code sits below the features"],
  ["server", ["src"], "the server never imports client code; share it through shared/"],
  ["server/routes", ["server/models", "server/db"], "routes call services; only services touch models"],
  ["server/http", ["server/models", "server/db", "server/routes"], "HTTP plumbing calls services, never models"],
  [
    "server/services",
    ["server/routes", "server/http"],
    "services know nothing of routes or HTTP; they throw the errors of server/errors.ts",
  ],
  [
    "server/integrations",
    ["server/services", "server/routes", "server/http"],
    "integrations (payments, mail, storage) are a floor below the services",
  ],
  ["server/models", ["server/services", "server/routes", "server/http", "server/integrations"], "models are the bottom layer"],
  [
    "server/errors.ts",
    ["server/services", "server/routes", "server/http", "server/models", "server/integrations"],
    "errors are neutral: every floor may throw them",
  ],
];
// shared/ may use only these packages: no I/O, no framework.
const SHARED_PACKAGES = new Set(["zod"]);

const inside = (file, folder) => file === folder || file.startsWith(`${folder}/`);

const importDirection = {
  meta: { type: "problem", schema: [], messages: { forbidden: "{{from}} must not import {{to}}: {{why}}." } },
  create(context) {
    const file = path.relative(root, context.filename).split(path.sep).join("/");
    function check(node) {
      const spec = node.source && typeof node.source.value === "string" ? node.source.value : null;
      if (!spec) return;
      if (inside(file, "shared") && !spec.startsWith(".")) {
        const pkg = spec.startsWith("@") ? spec.split("/").slice(0, 2).join("/") : spec.split("/")[0];
        if (!SHARED_PACKAGES.has(pkg)) {
          context.report({
            node,
            messageId: "forbidden",
            data: { from: "shared/", to: spec, why: "shared/ stays free of I/O and frameworks" },
          });
        }
        return;
      }
      if (!spec.startsWith(".")) return;
      const target = path
        .relative(root, path.resolve(path.dirname(context.filename), spec))
        .split(path.sep)
        .join("/");
      if (inside(target, "shared/engine") && !inside(file, "shared/engine") && target !== "shared/engine/index.ts") {
        context.report({
          node,
          messageId: "forbidden",
          data: { from: file, to: target, why: "the engine's public API is shared/engine/index.ts" },
        });
      }
      // Client features stand alone: what two features share lives in src/components or src/lib.
      const feature = (f) => (inside(f, "src/features") ? f.split("/")[2] : null);
      if (feature(file) && feature(target) && feature(file) !== feature(target)) {
        context.report({
          node,
          messageId: "forbidden",
          data: {
            from: `src/features/${feature(file)}/`,
            to: `src/features/${feature(target)}/`,
            why: "a feature never imports another; share through src/components or src/lib, or compose on the page",
          },
        });
      }
      for (const [from, forbidden, why] of BOUNDARIES) {
        if (!inside(file, from)) continue;
        const hit = forbidden.find((f) => inside(target, f));
        if (hit) context.report({ node, messageId: "forbidden", data: { from: `${from}/`, to: `${hit}/`, why } });
      }
    }
    return { ImportDeclaration: check, ExportNamedDeclaration: check, ExportAllDeclaration: check, ImportExpression: check };
  },
};

export default tseslint.config(
  { ignores: ["dist/**", "node_modules/**", ".data/**", "test-results/**"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx,js}"],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    settings: {
      "import-x/resolver": { node: { extensions: [".ts", ".tsx", ".js"] } },
      "import-x/parsers": { "@typescript-eslint/parser": [".ts", ".tsx"] },
      "import-x/extensions": [".ts", ".tsx", ".js"],
    },
    plugins: { cellarpact: { rules: { "import-direction": importDirection } }, "import-x": importX },
    rules: {
      "cellarpact/import-direction": "error",
      "import-x/no-cycle": ["error", { ignoreExternal: true }],
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports" }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-namespace": "off",
    },
  },
  {
    // A model's interface takes its field types from its column object (server/db/columns.ts); Sequelize fills the fields.
    files: ["server/models/*.ts"],
    rules: {
      "@typescript-eslint/no-unsafe-declaration-merging": "off",
      "@typescript-eslint/no-empty-object-type": ["error", { allowInterfaces: "with-single-extends" }],
    },
  },
  {
    files: ["src/**/*.tsx", "src/**/*.ts"],
    plugins: { "react-hooks": reactHooks },
    rules: { ...reactHooks.configs.recommended.rules },
  },
  // Formatting is Prettier's job (checked by `npm run lint`); turn off the rules that would fight it.
  prettierConfig,
);
