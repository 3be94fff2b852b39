/**
 * Record PDF benchmark: renders a record with 30 connector segments and 8 photos 30 times (after
 * a few warm-up renders) and prints the median and 95th-percentile milliseconds per render with
 * the peak RSS and heap used. The machine's load average is recorded beside the times: on a
 * busy machine wall-clock times rise while CPU time per render stays close.
 * Run: npx tsx bench/pdf.bench.ts   (writes bench/results/pdf.json)
 * Goal: median < 100 ms per render.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import { performance } from "node:perf_hooks";
import { PDFDocument } from "pdf-lib";
import { renderRecordPdf } from "../lib/records/pdf/render";
import { recordInputFixture } from "../tests/fixtures/records/record-input";

const RUNS = 30;
const WARMUP = 3;
const MB = 1024 * 1024;

function percentile(sorted: readonly number[], p: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i] ?? Number.NaN;
}

async function main(): Promise<void> {
  const input = await recordInputFixture({ segments: 30, photos: 8 });
  let peakRss = process.memoryUsage().rss;
  let peakHeap = process.memoryUsage().heapUsed;
  const sample = () => {
    const m = process.memoryUsage();
    peakRss = Math.max(peakRss, m.rss);
    peakHeap = Math.max(peakHeap, m.heapUsed);
  };
  let bytes = 0;
  let pages = 0;
  for (let i = 0; i < WARMUP; i++) bytes = (await renderRecordPdf(input)).length;
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const pdf = await renderRecordPdf(input);
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
    sample();
    bytes = pdf.length;
    if (i === 0) pages = (await PDFDocument.load(pdf)).getPageCount();
  }
  const sorted = [...times].sort((a, b) => a - b);
  const cpuSorted = [...cpu].sort((a, b) => a - b);
  const result = {
    runs: RUNS,
    segments: input.data.ventRun?.segments.length ?? 0,
    photos: input.photos.length,
    findings: input.findings.length,
    pages,
    pdfBytes: bytes,
    medianMs: Math.round(percentile(sorted, 50) * 10) / 10,
    p95Ms: Math.round(percentile(sorted, 95) * 10) / 10,
    minMs: Math.round((sorted[0] ?? 0) * 10) / 10,
    /** CPU time of the process per render (includes the garbage collector's helper threads). */
    cpuMedianMs: Math.round(percentile(cpuSorted, 50) * 10) / 10,
    loadAverage1m: Math.round(os.loadavg()[0]! * 100) / 100,
    peakRssMb: Math.round((peakRss / MB) * 10) / 10,
    peakHeapUsedMb: Math.round((peakHeap / MB) * 10) / 10,
    goal: "median < 100 ms",
    node: process.version,
    at: new Date().toISOString(),
  };
  console.log(`record PDF (${result.segments} segments, ${result.photos} photos, ${result.pages} pages, ${Math.round(bytes / 1024)} KiB): median ${result.medianMs} ms, p95 ${result.p95Ms} ms, min ${result.minMs} ms (CPU median ${result.cpuMedianMs} ms, load ${result.loadAverage1m}); peak RSS ${result.peakRssMb} MB, heap used ${result.peakHeapUsedMb} MB`);
  mkdirSync("bench/results", { recursive: true });
  writeFileSync("bench/results/pdf.json", `${JSON.stringify(result, null, 2)}\n`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
