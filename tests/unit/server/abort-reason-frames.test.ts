import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";
import { describe, expect, it } from "vitest";
import { releaseAbortReasonFrames } from "@/scripts/server.mjs";

// A full collection on demand (the documented --expose-gc flag, set at run time for this file).
setFlagsFromString("--expose-gc");
const collect = runInNewContext("gc") as () => void;
// A WeakRef keeps its target alive until the current job ends (ECMA-262 AddToKeptObjects), so collect on a later turn.
const gc = async () => {
  await new Promise((resolve) => setTimeout(resolve, 0));
  collect();
};

/**
 * An object reachable only as the receiver of a frame on the stack of the abort reason, as a
 * finished render's store is reachable from React's cacheController reason through an Immediate.
 */
function abortHoldingReceiver(Controller: typeof AbortController, reason: () => unknown): { held: WeakRef<object>; controller: AbortController } {
  const store = { request: "a whole render", payload: new Array(10_000).fill("x") };
  const controller = new Controller();
  function onImmediate(this: object) {
    controller.abort(reason());
  }
  onImmediate.call(store);
  return { held: new WeakRef(store), controller };
}

describe("an abort reason's stack (scripts/server.mjs releaseAbortReasonFrames)", () => {
  it("unpatched, the signal's Error reason keeps its frames' receivers alive (the leak)", async () => {
    class Plain extends AbortController {}
    const { held, controller } = abortHoldingReceiver(Plain, () => new Error("This render completed successfully."));
    await gc();
    expect(held.deref(), "held through reason → CallSiteInfo → receiver").toBeDefined();
    expect(controller.signal.aborted).toBe(true);
  });

  it("patched, the reason keeps its stack as text only, and the receiver is collected", async () => {
    class Released extends AbortController {}
    releaseAbortReasonFrames(Released);
    const { held, controller } = abortHoldingReceiver(Released, () => new Error("This render completed successfully."));
    await gc();
    expect(held.deref()).toBeUndefined();
    const reason = controller.signal.reason as Error;
    expect(reason.message).toBe("This render completed successfully.");
    expect(reason.stack).toContain("onImmediate");
  });

  it("a reason-less abort still gets an AbortError DOMException, without its frames", async () => {
    class Released extends AbortController {}
    releaseAbortReasonFrames(Released);
    const { held, controller } = abortHoldingReceiver(Released, () => undefined);
    await gc();
    expect(held.deref()).toBeUndefined();
    expect(controller.signal.reason).toBeInstanceOf(DOMException);
    expect((controller.signal.reason as DOMException).name).toBe("AbortError");
  });

  it("other reasons pass through unchanged, and patching twice wraps once", async () => {
    class Released extends AbortController {}
    releaseAbortReasonFrames(Released);
    const once = Released.prototype.abort;
    releaseAbortReasonFrames(Released);
    expect(Released.prototype.abort).toBe(once);
    const controller = new Released();
    controller.abort("a plain string");
    expect(controller.signal.reason).toBe("a plain string");
  });
});

describe("the idle collection (scripts/server.mjs createIdleCollector)", () => {
  it("collects once no request has been in flight for idleMs, after enough were served, and never during one", async () => {
    const { createIdleCollector } = await import("@/scripts/server.mjs");
    let clock = 0;
    let collections = 0;
    const idle = createIdleCollector({ collect: () => (collections += 1), now: () => clock, idleMs: 10_000, minRequests: 3 });
    for (let i = 0; i < 3; i++) {
      idle.started();
      clock += 100;
      idle.finished();
    }
    clock += 9_000;
    expect(idle.tick(), "not idle long enough").toBe(false);
    idle.started();
    clock += 20_000;
    expect(idle.tick(), "a request is in flight").toBe(false);
    idle.finished();
    clock += 10_000;
    expect(idle.tick()).toBe(true);
    expect(collections).toBe(1);
    clock += 60_000;
    expect(idle.tick(), "nothing served since").toBe(false);
    expect(collections).toBe(1);
  });
});
