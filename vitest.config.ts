import { defineConfig } from "vitest/config";
import { aliases } from "./aliases.ts";

// Unit tests sit beside the code; API and browser tests live under tests/. The three projects run one after the
// other (groupOrder): the API tests restart the test PostgreSQL cluster once, which must not hit a browser test,
// and the engine's property tests would otherwise compete for the two cores with servers under test. API and
// browser files run one at a time because they share one database. expect.poll waits up to 15 s there (its default
// is 1 s): a browser or worker on a loaded 2-core machine can take longer than that to show a change.
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias: aliases },
        test: {
          name: "unit",
          include: ["shared/**/*.test.ts", "server/**/*.test.ts", "src/**/*.test.ts"],
          environment: "node",
          testTimeout: 120_000,
          sequence: { groupOrder: 0 },
        },
      },
      {
        resolve: { alias: aliases },
        test: {
          name: "api",
          include: ["tests/api/**/*.test.ts"],
          environment: "node",
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false,
          expect: { poll: { timeout: 15_000 } },
          sequence: { groupOrder: 1 },
        },
      },
      {
        resolve: { alias: aliases },
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          testTimeout: 120_000,
          hookTimeout: 180_000,
          fileParallelism: false,
          expect: { poll: { timeout: 15_000 } },
          sequence: { groupOrder: 2 },
        },
      },
    ],
  },
});
