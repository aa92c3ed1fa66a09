/**
 * Entry of the fleet's Web Workers. It listens before it imports anything: the plan modules load
 * asynchronously (the registry hashes its files on first import), and a message that arrived
 * while no listener was set would be lost. Messages are queued until the modules are in, then
 * handled in order.
 *
 * @module
 */
import type { FromWorker, ToWorker } from "./_worker.ts";

// deno-lint-ignore no-explicit-any
const scope = globalThis as any;
const queued: ToWorker[] = [];
const ready: { handle?: (m: ToWorker) => void } = {};
scope.onmessage = (ev: MessageEvent<ToWorker>) => {
  if (ready.handle) ready.handle(ev.data);
  else queued.push(ev.data);
};
const { handleMessage } = await import("./_worker.ts");
const reply = (a: FromWorker) => scope.postMessage(a);
ready.handle = (m) => handleMessage(m, reply);
for (const m of queued.splice(0)) ready.handle(m);
