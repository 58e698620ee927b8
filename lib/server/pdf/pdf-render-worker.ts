/**
 * The PDF render worker: a worker thread that renders one sheet model at a time and answers with
 * the PDF bytes. It holds react-pdf's layout engine (yoga, WebAssembly), fontkit and the chart
 * caches; the pool in pdf-render-pool.ts throws the whole worker away after a failed render, so
 * whatever state a failure leaves behind dies with it.
 */
import os from "node:os";
import { parentPort } from "node:worker_threads";
import type { SheetModel } from "../../sheet/types";
import type { RenderReply, RenderRequest } from "./pdf-render-protocol";
import { renderSheetPdf } from "./render-sheet-pdf";

const port = parentPort;
if (!port) throw new Error("pdf-render-worker runs as a worker thread only.");

// Requests to the web server go first: on Linux a thread's nice value is its own, and pid 0 is
// this thread, so only the renderer yields the processor.
try {
  os.setPriority(0, os.constants.priority.PRIORITY_BELOW_NORMAL);
} catch {
  // Without the right (or on a system without per-thread priority) it renders at normal priority.
}

port.on("message", async (request: RenderRequest) => {
  let reply: RenderReply;
  try {
    const pdf = await renderSheetPdf(request.model as SheetModel);
    reply = { id: request.id, ok: true, pdf: new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength) };
  } catch (error) {
    reply = { id: request.id, ok: false, message: error instanceof Error ? `${error.name}: ${error.message}` : String(error) };
  }
  port.postMessage(reply);
});

port.postMessage({ ready: true } satisfies RenderReply);
