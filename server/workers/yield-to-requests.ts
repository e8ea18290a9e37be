// Imported first by every worker-thread task module: lowers this thread's scheduling priority so that, on a machine
// with fewer cores than busy threads, the event loop answering requests is served before the computations it
// handed off. On Linux setpriority(2) on pid 0 changes only the calling thread; elsewhere it may lower the whole
// process, which only costs speed, so it is done on Linux alone.
import os from "node:os";
import { isMainThread } from "node:worker_threads";

const NICE = 10;

// A task module imported on the main thread (a test, an in-place merge) must leave that thread as it is.
if (process.platform === "linux" && !isMainThread) {
  try {
    os.setPriority(0, NICE);
  } catch {
    // A sandbox may refuse even lowering a priority; the work is then merely scheduled as before.
  }
}
