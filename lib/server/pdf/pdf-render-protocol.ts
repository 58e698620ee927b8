/** Messages between the PDF render pool and its worker threads (structured clone, no classes). */
export type RenderRequest = { id: number; model: unknown };

export type RenderReply =
  | { ready: true }
  | { id: number; ok: true; pdf: Uint8Array }
  | { id: number; ok: false; message: string };
