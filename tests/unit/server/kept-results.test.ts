import { AsyncLocalStorage } from "node:async_hooks";
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
const { KeptResults } = await import("@/lib/server/kept-results");

setFlagsFromString("--expose-gc");
const collect = runInNewContext("gc") as () => void;
// A WeakRef keeps its target until the current job ends (ECMA-262 AddToKeptObjects): collect on a later turn.
const gc = async () => {
  await new Promise((resolve) => setTimeout(resolve, 0));
  collect();
};

describe("KeptResults (lib/server/kept-results.ts)", () => {
  it("makes a value once, shares it while it is being made, and keeps it", async () => {
    const kept = new KeptResults<string>(4);
    let made = 0;
    const make = async () => {
      made += 1;
      await new Promise((resolve) => setTimeout(resolve, 5));
      return "svg";
    };
    const [a, b] = await Promise.all([kept.get("k", make), kept.get("k", make)]);
    expect([a, b, made]).toEqual(["svg", "svg", 1]);
    expect(await kept.get("k", make)).toBe("svg");
    expect(made).toBe(1);
  });

  it("forgets a failure, so the next caller tries again", async () => {
    const kept = new KeptResults<string>(4);
    await expect(kept.get("k", () => Promise.reject(new Error("render failed")))).rejects.toThrow("render failed");
    expect(kept.size).toBe(0);
    expect(await kept.get("k", async () => "second try")).toBe("second try");
  });

  it("keeps at most its number of entries, the least recently asked for out first", async () => {
    const kept = new KeptResults<number>(2);
    await kept.get("a", async () => 1);
    await kept.get("b", async () => 2);
    await kept.get("a", async () => -1); // a is now the newest
    await kept.get("c", async () => 3); // b goes
    expect(kept.size).toBe(2);
    expect(await kept.get("a", async () => -1)).toBe(1);
    expect(await kept.get("b", async () => 22)).toBe(22);
  });

  it("does not keep the request that made a value: its AsyncLocalStorage store is collected", async () => {
    // A promise made inside a request carries the request's store (Node's AsyncLocalStorage);
    // the old caches kept that promise, and with it the request, response and render.
    const requests = new AsyncLocalStorage<{ response: string[] }>();
    const kept = new KeptResults<Buffer>(4);
    const plainCache = new Map<string, Promise<Buffer>>();
    const serve = (cache: "kept" | "promise") => {
      const store = { response: new Array(10_000).fill("a whole response") };
      const ref = new WeakRef(store);
      return requests.run(store, async () => {
        const make = async () => {
          await new Promise((resolve) => setTimeout(resolve, 1));
          return Buffer.from("%PDF-1.7");
        };
        if (cache === "kept") await kept.get("digest", make);
        else {
          const pdf = make();
          plainCache.set("digest", pdf);
          await pdf;
        }
        return ref;
      });
    };
    const viaKept = await serve("kept");
    const viaPromise = await serve("promise");
    await gc();
    expect(viaPromise.deref(), "a kept promise holds its request's store").toBeDefined();
    expect(viaKept.deref()).toBeUndefined();
    expect(await kept.get("digest", async () => Buffer.from("not again"))).toEqual(Buffer.from("%PDF-1.7"));
  });
});
