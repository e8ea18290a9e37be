import seedrandom from "seedrandom";
import { nkNetwork } from "../generators";
import { networkToDefinition, compileDefinition, printRuleText, readRuleText, parseRuleText } from ".";
for (const [n, k] of [[16, 16], [20, 20]]) {
  const net = nkNetwork({ n: n!, k: k!, p: 0.5, random: seedrandom("b" + k) });
  const one = { names: net.names, regulators: net.regulators.map((r, i) => (i === 0 ? r : new Int32Array(0))), tables: net.tables.map((t, i) => (i === 0 ? t : new Uint8Array([0]))) };
  let t = performance.now();
  const def = networkToDefinition(one);
  const tMin = performance.now() - t;
  t = performance.now();
  const text = printRuleText(def);
  const tPrint = performance.now() - t;
  t = performance.now();
  const back = compileDefinition(readRuleText(text));
  const tBack = performance.now() - t;
  console.log(`one node with K=${k}: minimise ${tMin.toFixed(0)} ms, print ${tPrint.toFixed(0)} ms (${(text.length / 1024).toFixed(0)} KiB), parse+compile ${tBack.toFixed(0)} ms, equal=${back.tables[0]!.every((v, r) => v === one.tables[0]![r])}`);
}
console.log(parseRuleText("A' = " + "(".repeat(100000) + "A" + ")".repeat(100000)).errors[0]?.reason);
console.log(parseRuleText("A' = " + "!".repeat(100000) + "A").errors[0]?.reason);
