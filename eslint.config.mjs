import tseslint from "typescript-eslint";

/**
 * Lint that keeps the house standing: the check engine stays pure, schemas
 * stay importable by client forms, and no page or route reaches the database
 * around the service layer.
 */
export default tseslint.config(
  { ignores: [".next/**", "node_modules/**", "drizzle/**", "data/**", "dist/**", "uploads/**", "test-results/**", "next-env.d.ts", "**/*.mjs"] },
  ...tseslint.configs.recommended,
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", destructuredArrayIgnorePattern: "^_" }],
      "@typescript-eslint/no-explicit-any": "error",
    },
  },
  {
    files: ["lib/compliance/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*", "react", "react-dom", "drizzle-orm", "drizzle-orm/*", "better-sqlite3"], message: "The check engine is pure: no framework or database." },
            { group: ["fs", "node:*", "path"], message: "The check engine is pure: no file system or clock." },
            { group: ["@/db/*", "**/db/*", "**/services/*", "**/services/**"], message: "The check engine calls nothing." },
          ],
        },
      ],
      "no-restricted-globals": ["error", { name: "Date", message: "The engine has no clock." }],
      "no-restricted-properties": ["error", { object: "Math", property: "random", message: "The engine is deterministic." }],
    },
  },
  {
    files: ["lib/schemas/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["drizzle-orm", "drizzle-orm/*", "**/db/*", "**/db"], message: "Schemas import zod only, so client forms can use them." }] }],
    },
  },
  {
    files: ["app/**/*.ts", "app/**/*.tsx", "components/**/*.tsx", "components/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [{ group: ["@/db/schema", "@/db/schema/*", "drizzle-orm", "drizzle-orm/*"], message: "Pages and routes go through lib/services, which scope every query to the organisation." }] },
      ],
    },
  },
);
