/**
 * Sheet benchmark (run by `npm run bench`, not by `npm test`): build the sheet model, render
 * the web page to HTML on the server, and render the PDF, for the invented doubler sheet in
 * fixtures/sheets (43 table rows, 6 charts); cold (first call in the process) and warm (median
 * of the next runs, wall and CPU time). Chart pictures are cached by spec, so warm runs reuse them.
 * The PDF is also rendered the way the server does it, through the worker-thread pool, against the
 * in-process render as the reference in the same process (their ratio), and the event loop's
 * longest delay during each render is measured both ways.
 * It runs under vitest only because vitest resolves the server-only guard and react-pdf's
 * ESM packages the way Next does; nothing here is a timed assertion.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { monitorEventLoopDelay, performance } from "node:perf_hooks";
import { Worker } from "node:worker_threads";
import { createElement } from "react";
import { expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

it("times the sheet model, the web page HTML and the PDF", { timeout: 600_000 }, async () => {
  const { buildSheetModel } = await import("@/lib/sheet");
  const { renderSheetPdf } = await import("@/lib/server/pdf/render-sheet-pdf");
  const { renderSheetChartSvgs } = await import("@/lib/server/charts/render-chart");
  const { SheetView } = await import("@/components/sheet/sheet-view");
  const { renderToStaticMarkup } = await import("react-dom/server");
  const input = JSON.parse(readFileSync(path.resolve(__dirname, "../../fixtures/sheets/doubler-full.json"), "utf8"));

  // Wall time, and the process's CPU time alongside (other work on the machine moves the first).
  const cpu = { model: [] as number[], html: [] as number[], pdf: [] as number[] };
  let lastCpuMs = 0;
  const time = async <T>(fn: () => Promise<T> | T): Promise<[number, T]> => {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const value = await fn();
    const wall = performance.now() - t0;
    const c = process.cpuUsage(c0);
    lastCpuMs = (c.user + c.system) / 1000;
    return [wall, value];
  };
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  const html = async (model: ReturnType<typeof buildSheetModel>) => {
    const svgs = await renderSheetChartSvgs(model);
    return renderToStaticMarkup(createElement(SheetView, { model, chartSvgs: svgs }));
  };

  const [modelCold, model] = await time(() => buildSheetModel(input));
  const [htmlCold, page] = await time(() => html(model));
  const [pdfCold, pdf] = await time(() => renderSheetPdf(model));
  const runs = Number(process.env.BENCH_RUNS ?? 3);
  const warm = { model: [] as number[], html: [] as number[], pdf: [] as number[] };
  for (let i = 0; i < runs; i++) {
    warm.model.push((await time(() => buildSheetModel(input)))[0]);
    cpu.model.push(lastCpuMs);
    warm.html.push((await time(() => html(model)))[0]);
    cpu.html.push(lastCpuMs);
    warm.pdf.push((await time(() => renderSheetPdf(model)))[0]);
    cpu.pdf.push(lastCpuMs);
  }

  // The server's way: the same model through the pool's worker thread (built from the same source).
  const { PdfRenderPool } = await import("@/lib/server/pdf/pdf-render-pool");
  const { buildRenderWorkerForNode } = await import("../../tests/unit/pdf/workers/build-render-worker");
  const workerFile = await buildRenderWorkerForNode();
  const pool = new PdfRenderPool((resourceLimits) => new Worker(workerFile, { resourceLimits }), { workers: 1, timeoutMs: 600_000, heapMb: 512, maxQueued: 4 });
  // What one render costs every other request of the process: the time the event loop spent
  // running it (busy time, from its utilization) and the longest any timer waited meanwhile.
  const loopCost = async (fn: () => Promise<unknown>) => {
    const histogram = monitorEventLoopDelay({ resolution: 5 });
    histogram.enable();
    const before = performance.eventLoopUtilization();
    await fn();
    const used = performance.eventLoopUtilization(before);
    histogram.disable();
    return { busyMs: used.active, longestWaitMs: histogram.max / 1e6 };
  };
  const [workerCold] = await time(() => pool.render(model));
  const inWorker = { wall: [] as number[], cpu: [] as number[], busy: [] as number[], wait: [] as number[] };
  const inProcess = { wall: [] as number[], cpu: [] as number[], busy: [] as number[], wait: [] as number[] };
  // The same measure over an idle stretch as long as a render: what the machine's other load alone costs a timer.
  const idle = { wait: [] as number[] };
  for (let i = 0; i < runs; i++) {
    // Interleaved, so that other load on the machine weighs on both alike.
    const [wall] = await time(() => pool.render(model));
    inWorker.wall.push(wall);
    inWorker.cpu.push(lastCpuMs);
    inProcess.wall.push((await time(() => renderSheetPdf(model)))[0]);
    inProcess.cpu.push(lastCpuMs);
    for (const [into, render] of [
      [inWorker, () => pool.render(model)],
      [inProcess, () => renderSheetPdf(model)],
    ] as const) {
      const cost = await loopCost(render);
      into.busy.push(cost.busyMs);
      into.wait.push(cost.longestWaitMs);
    }
    idle.wait.push((await loopCost(() => new Promise((done) => setTimeout(done, wall)))).longestWaitMs);
  }
  await pool.close();

  const row = (name: string, cold: number, w: number[], c: number[]) =>
    console.log(`${name.padEnd(22)} ${cold.toFixed(0).padStart(8)} ms ${median(w).toFixed(0).padStart(11)} ms ${median(c).toFixed(0).padStart(11)} ms`);
  const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page\b/g) ?? []).length;
  console.log(`\nSheet: ${model.header.partNumber}, ${model.specifications.rows.length} spec rows, ${model.charts.length} charts, ${model.statistics.groups.length} statistics groups, ${pages} PDF pages`);
  console.log(`${"step".padEnd(22)} ${"cold".padStart(11)} ${"warm (median)".padStart(14)} ${"warm CPU".padStart(14)}`);
  row("sheet model", modelCold, warm.model, cpu.model);
  row("web page HTML", htmlCold, warm.html, cpu.html);
  row("PDF", pdfCold, warm.pdf, cpu.pdf);
  row("PDF in a worker thread", workerCold, inWorker.wall, inWorker.cpu);
  console.log(`HTML ${(page.length / 1024).toFixed(0)} kB, PDF ${(pdf.byteLength / 1024).toFixed(0)} kB; aim: warm PDF under 1000 ms`);
  console.log(
    `PDF in a worker thread / in process, warm medians of the same ${runs} interleaved runs: ${(median(inWorker.wall) / median(inProcess.wall)).toFixed(2)}× ` +
      `(${median(inWorker.wall).toFixed(0)} ms / ${median(inProcess.wall).toFixed(0)} ms); CPU of the whole process ${(median(inWorker.cpu) / median(inProcess.cpu)).toFixed(2)}× ` +
      `(${median(inWorker.cpu).toFixed(0)} ms / ${median(inProcess.cpu).toFixed(0)} ms). The worker's cold time includes starting it.`,
  );
  console.log(
    `Event loop during one warm PDF render (medians of ${runs}): busy ${median(inProcess.busy).toFixed(0)} ms in process, ` +
      `${median(inWorker.busy).toFixed(0)} ms with the worker thread; longest wait of a timer ${median(inProcess.wait).toFixed(0)} ms in process, ` +
      `${median(inWorker.wait).toFixed(0)} ms with the worker thread, ${median(idle.wait).toFixed(0)} ms with nothing running`,
  );
  expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
});
