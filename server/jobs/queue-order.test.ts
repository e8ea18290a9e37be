import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { queuePositions, runsAheadInProject, shardJobPriority, startOrder, type UnfinishedRun } from "./queue-order";

const runs = fc
  .array(
    fc.record({
      projectId: fc.constantFrom("p1", "p2", "p3", "p4"),
      createdAt: fc.integer({ min: 0, max: 50 }),
      state: fc.constantFrom("queued" as const, "running" as const),
    }),
    { maxLength: 30 },
  )
  .map((rs) => rs.map((r, i) => ({ ...r, id: `r${String(i).padStart(2, "0")}` })));

// The reference simulates the rule plainly: repeatedly start the queued run that a free thread would take.
function referenceOrder(unfinished: UnfinishedRun[]): string[] {
  const older = (a: UnfinishedRun, b: UnfinishedRun) => a.createdAt - b.createdAt || (a.id < b.id ? -1 : 1);
  const all = [...unfinished].sort(older);
  const queued = all.filter((r) => r.state === "queued");
  const firstOfProject = (r: UnfinishedRun) => all.find((o) => o.projectId === r.projectId) === r;
  return [...queued.filter(firstOfProject), ...queued.filter((r) => !firstOfProject(r))].map((r) => r.id);
}

describe("startOrder", () => {
  it("matches the plain reference: first runs of idle projects, then the rest, each oldest first", () => {
    fc.assert(
      fc.property(runs, (rs) => {
        expect(startOrder(rs).map((r) => r.id)).toEqual(referenceOrder(rs));
      }),
      { seed: 1010, numRuns: 300 },
    );
  });

  it("starts a project's only run before any run of a project with work ahead, whatever that project has queued", () => {
    fc.assert(
      fc.property(runs, fc.integer({ min: 0, max: 60 }), (rs, createdAt) => {
        const lone: UnfinishedRun = { id: "lone", projectId: "idle", createdAt, state: "queued" };
        const order = startOrder([...rs, lone]);
        const at = order.findIndex((r) => r.id === "lone");
        for (const r of order.slice(at + 1))
          expect(r.createdAt >= createdAt || runsAheadInProject(r, rs) > 0).toBe(true);
        for (const r of order.slice(0, at)) expect(runsAheadInProject(r, rs)).toBe(0);
      }),
      { seed: 1011, numRuns: 300 },
    );
  });

  it("keeps each project's runs in submission order and lists every queued run once", () => {
    fc.assert(
      fc.property(runs, (rs) => {
        const order = startOrder(rs);
        expect(order.map((r) => r.id).sort()).toEqual(
          rs
            .filter((r) => r.state === "queued")
            .map((r) => r.id)
            .sort(),
        );
        for (const p of ["p1", "p2", "p3", "p4"]) {
          const mine = order.filter((r) => r.projectId === p);
          for (let i = 1; i < mine.length; i++)
            expect(runsAheadInProject(mine[i - 1]!, rs)).toBeLessThan(runsAheadInProject(mine[i]!, rs));
        }
      }),
      { seed: 1012, numRuns: 300 },
    );
  });
});

describe("queuePositions and shardJobPriority", () => {
  it("number eight queued runs of one project behind another project's single run", () => {
    const busy = Array.from({ length: 8 }, (_, i) => ({
      id: `a${i}`,
      projectId: "a",
      createdAt: i,
      state: i < 2 ? ("running" as const) : ("queued" as const),
    }));
    const positions = queuePositions([...busy, { id: "b0", projectId: "b", createdAt: 100, state: "queued" }]);
    expect(positions.get("b0")).toBe(1);
    expect(positions.get("a2")).toBe(2);
    expect(positions.get("a7")).toBe(7);
    expect(positions.has("a0")).toBe(false);
  });

  it("gives the front priority only to the first shard of a run with nothing ahead", () => {
    expect(shardJobPriority(0, 0)).toBeGreaterThan(shardJobPriority(0, 1));
    expect(shardJobPriority(0, 0)).toBeGreaterThan(shardJobPriority(3, 0));
    expect(shardJobPriority(0, 1)).toBe(shardJobPriority(3, 0));
  });
});
