import "server-only";

/**
 * A response body that sends kept PDF bytes as they are. `new Response(new Uint8Array(pdf))`
 * copied the bytes and the Response copied them again into its stream: two fresh 0.2–0.4 MB
 * buffers per download of a kept PDF, which under load left the allocator's heap fragmented and
 * the process larger (`npm run bench`, load). A stream of the one chunk is sent without a copy;
 * nothing detaches it (a default stream, not a byte stream), so the kept bytes stay whole.
 */
export function pdfBody(pdf: Uint8Array): ReadableStream<Uint8Array> {
  return new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(pdf);
      controller.close();
    },
  });
}
