// A stand-in render worker for the pool's tests: it speaks the pool's protocol and does what the
// "model" asks — lay out a chain of nested yoga nodes (react-pdf's layout engine, WebAssembly), loop
// forever, fill its heap, or exit.
import { parentPort } from "node:worker_threads";
import { loadYoga } from "yoga-layout/load";

const yoga = await loadYoga();

function layoutNested(depth) {
  const root = yoga.Node.create();
  let node = root;
  for (let i = 0; i < depth; i++) {
    const child = yoga.Node.create();
    child.setPadding(yoga.EDGE_LEFT, 1);
    node.insertChild(child, 0);
    node = child;
  }
  root.calculateLayout(500, 500);
  return root.getComputedWidth();
}

parentPort.on("message", ({ id, model }) => {
  switch (model.behave) {
    case "hang":
      for (;;);
    case "fill-heap": {
      const hoard = [];
      for (;;) hoard.push(new Array(100_000).fill(hoard.length));
    }
    case "exit":
      process.exit(3);
    case "slow": {
      const until = Date.now() + (model.ms ?? 100);
      while (Date.now() < until);
      parentPort.postMessage({ id, ok: true, pdf: new TextEncoder().encode("%PDF-stand-in slow") });
      break;
    }
    default:
      try {
        const width = layoutNested(model.depth ?? 3);
        parentPort.postMessage({ id, ok: true, pdf: new TextEncoder().encode(`%PDF-stand-in ${width}`) });
      } catch (error) {
        parentPort.postMessage({ id, ok: false, message: String(error) });
      }
  }
});
parentPort.postMessage({ ready: true });
