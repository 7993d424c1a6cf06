/// <reference lib="webworker" />
// Reads a logger's CSV off the page's thread, so a 100,000-row file never freezes the screen.
// The parsed file stays here between the preview and the check; nothing is stored by the worker.
import { answer, type WorkerAsk } from "./csv-import-protocol";

const state = { table: null };
self.onmessage = async (event: MessageEvent<WorkerAsk>) => {
  (self as unknown as DedicatedWorkerGlobalScope).postMessage(await answer(event.data, state));
};
