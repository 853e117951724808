import { defineConfig } from "vitest/config";
import path from "node:path";

export default defineConfig({
  resolve: {
    alias: [
      // Services import "server-only" so no client bundle can include them; tests call them directly.
      { find: /^server-only$/, replacement: path.resolve(__dirname, "tests/support/server-only.ts") },
      { find: "@", replacement: path.resolve(__dirname, ".") },
    ],
  },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/integration/**/*.test.ts"],
    environment: "node",
    pool: "forks",
    testTimeout: 20000,
  },
});
