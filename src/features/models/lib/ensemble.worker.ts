// The ensemble summary off the page's thread: one request in, the summary or an error out.
import { ensembleSummary, type EnsembleRequest } from "./ensemble-summary";

self.onmessage = (e: MessageEvent<EnsembleRequest>) => {
  try {
    self.postMessage({ ok: true, summary: ensembleSummary(e.data) });
  } catch (err) {
    self.postMessage({ ok: false, message: err instanceof Error ? err.message : String(err) });
  }
};
