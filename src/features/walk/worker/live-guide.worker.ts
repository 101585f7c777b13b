// The Walk screen's live-guide worker: the locator runs here, off the thread that draws taps.
import { liveWorkerBody } from "../model/live-worker-body";

declare const self: DedicatedWorkerGlobalScope;

const body = liveWorkerBody({
  post: (reply) => self.postMessage(reply),
  later: (step) => setTimeout(step, 0),
  now: () => performance.now(),
});
self.onmessage = (e: MessageEvent<unknown>) => body.receive(e.data);
