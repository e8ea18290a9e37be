// The structure summary off the page's thread: one message in (rule text), one out (the summary or an error).
import { structureSummary } from "./structure-summary";

self.onmessage = (e: MessageEvent<string>) => {
  try {
    self.postMessage({ ok: true, summary: structureSummary(e.data) });
  } catch (err) {
    self.postMessage({ ok: false, message: err instanceof Error ? err.message : String(err) });
  }
};
