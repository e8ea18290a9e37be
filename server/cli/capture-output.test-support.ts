// Command tests read what a command writes: both standard streams are captured (and silenced) until the test calls
// vi.restoreAllMocks().
import { vi } from "vitest";

export function captureOutput(): { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(process.stdout, "write").mockImplementation((chunk: string | Uint8Array) => (out.push(String(chunk)), true));
  vi.spyOn(process.stderr, "write").mockImplementation((chunk: string | Uint8Array) => (err.push(String(chunk)), true));
  return { out, err };
}
