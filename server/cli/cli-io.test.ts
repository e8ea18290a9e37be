import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { CommandError, integerOption, parseCommandArgs, readModel, UsageError } from "./cli-io";

const dir = mkdtempSync(join(tmpdir(), "emulant-cli-io-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("cli-io", () => {
  it("parseCommandArgs returns option values and positionals and refuses unknown options", () => {
    const { values, positionals } = parseCommandArgs(
      ["m.rules", "--time", "3", "--json"],
      { time: { type: "string" }, json: { type: "boolean" } },
      1,
    );
    expect(values).toEqual({ time: "3", json: true });
    expect(positionals).toEqual(["m.rules"]);
    expect(() => parseCommandArgs(["--fast"], { json: { type: "boolean" } })).toThrow(UsageError);
  });

  it("parseCommandArgs refuses an option given twice and positionals beyond the allowed count", () => {
    expect(() => parseCommandArgs(["--to", "sbml", "--to", "csv"], { to: { type: "string" } })).toThrow(
      /--to is given twice/,
    );
    expect(() => parseCommandArgs(["a", "b"], {}, 1)).toThrow(/unexpected argument "b"/);
    expect(() => parseCommandArgs(["a"], {}, 0)).toThrow(/unexpected argument "a"/);
  });

  it("integerOption checks the range, uses the fallback when absent and requires the option without one", () => {
    expect(integerOption("4", "--block", 1, 20)).toBe(4);
    expect(integerOption(undefined, "--time", 1, 8, 1)).toBe(1);
    expect(() => integerOption(undefined, "--rule", 0, 255)).toThrow(/--rule is required/);
    expect(() => integerOption("256", "--rule", 0, 255)).toThrow(/--rule must be an integer 0\.\.255, got "256"/);
    expect(() => integerOption("x", "--rule", 0, 255)).toThrow(UsageError);
  });

  it("readModel reads the model with its warnings and reports a parse error as file:line:column", async () => {
    const good = join(dir, "good.rules");
    writeFileSync(good, "A' = !B\nB' = A\n");
    expect((await readModel(good)).network.names).toEqual(["A", "B"]);
    const bad = join(dir, "bad.rules");
    writeFileSync(bad, "A' = (B\n");
    await expect(readModel(bad)).rejects.toThrow(CommandError);
    await expect(readModel(bad)).rejects.toThrow(new RegExp(`${bad.replace(/[.\\/]/g, "\\$&")}:1:\\d+: `));
    await expect(readModel(undefined)).rejects.toThrow(/the model file is missing/);
    await expect(readModel(join(dir, "m.json"))).rejects.toThrow(/cannot tell the format/);
  });
});
