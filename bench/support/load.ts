/** Running one autocannon cell and reducing its result to the figures the reports use. */
import autocannon, { type Options, type Request, type Result } from "autocannon";
import { median, round } from "./common";

export interface Cell {
  connections: number;
  durationS: number;
  requestsPerSecond: number;
  latencyP50Ms: number;
  latencyP99Ms: number;
  latencyMaxMs: number;
  requests: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  statusCodes: Record<string, number>;
}

export function reduce(result: Result, connections: number): Cell {
  return {
    connections,
    durationS: result.duration,
    requestsPerSecond: round(result.requests.average, 1),
    latencyP50Ms: result.latency.p50,
    latencyP99Ms: result.latency.p99,
    latencyMaxMs: result.latency.max,
    requests: result.requests.total,
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
    statusCodes: Object.fromEntries(Object.entries(result.statusCodeStats).map(([code, s]) => [code, s.count])),
  };
}

/** One bounded run: autocannon stops by itself after `duration` seconds. */
export async function run(options: Options & { connections: number; duration: number }): Promise<Cell> {
  const result = await autocannon({ timeout: 10, ...options });
  return reduce(result, options.connections);
}

/** The value below which `share` of the sorted values lie (nearest rank). */
export function percentile(sorted: readonly number[], share: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(share * sorted.length) - 1));
  return sorted[rank]!;
}

/** One endpoint as the interleaved run sends it. */
export interface LoadTarget {
  key: string;
  method: "GET" | "POST";
  path: string;
  headers: Record<string, string>;
  body?: string;
}

/** An endpoint's figures from an interleaved run, with its share of the ceiling measured beside it. */
export interface PairedCell extends Cell {
  /** The ceiling's requests per second in the slots next to this endpoint's (median). */
  ceilingRequestsPerSecond: number;
  /** Median over the rounds of (this slot's req/s) / (mean of the ceiling slots just before and after). */
  shareOfCeiling: number;
  shareByRound: number[];
  requestsPerSecondByRound: number[];
}

export interface InterleavedResult {
  ceiling: Cell & { requestsPerSecondBySlot: number[] };
  targets: Map<string, PairedCell>;
  firstResponseOnNewConnection: { p50Ms: number; maxMs: number };
  warmupS: number;
}

interface Slot {
  target: LoadTarget;
  /** Index into the measured slots' tallies, or -1 for warm-up. */
  tally: number;
}

/**
 * Every endpoint and the ceiling on the same open connections, switched in turn: after a warm-up
 * slot per endpoint, `rounds` rounds of [ceiling, endpoint 1, ceiling, endpoint 2, …] and a last
 * ceiling slot. Each endpoint's share of the ceiling is taken against the ceiling slots right
 * before and after it, so a machine whose speed drifts (a shared VM: the same cell moved ±25 %
 * from one run to the next when each endpoint ran once, back to back) compares like with like.
 *
 * Each request is counted for the slot it was sent in; requests sent in the first `settleS` of a
 * slot are not counted (the server is still answering the previous slot's requests then), so a
 * slot's figures are one endpoint's steady state.
 */
export async function runInterleaved(options: {
  url: string;
  connections: number;
  ceiling: LoadTarget;
  targets: readonly LoadTarget[];
  rounds: number;
  slotS: number;
  settleS: number;
  warmupS: number;
}): Promise<InterleavedResult> {
  const { ceiling, targets, rounds, slotS, settleS, connections } = options;
  const measured: LoadTarget[] = [];
  for (let r = 0; r < rounds; r++) for (const t of targets) measured.push(ceiling, t);
  measured.push(ceiling);
  const tallies = measured.map(() => ({ latencies: [] as number[], non2xx: 0, statusCodes: {} as Record<string, number> }));

  const warmupTargets = [ceiling, ...targets];
  let current: Slot = { target: warmupTargets[0]!, tally: -1 };
  let lastTally = -1;
  let lastStatus = 0;
  const firstResponses: number[] = [];
  const seenClients = new WeakSet<object>();
  const startedAt = performance.now();
  let warmedAt = Number.NaN;

  const request = {
    setupRequest: (req: Request, context: Record<string, unknown>): Request => {
      context.tally = current.tally;
      const { target } = current;
      return { ...req, method: target.method, path: target.path, headers: { ...target.headers }, body: target.body ?? "" };
    },
    onResponse: (status: number, _body: string, context: Record<string, unknown>) => {
      lastTally = typeof context.tally === "number" ? context.tally : -1;
      lastStatus = status;
    },
  };

  const capS = options.warmupS + warmupTargets.length + measured.length * (slotS + settleS) + 120;
  let finish!: (result: Result) => void;
  let fail!: (error: unknown) => void;
  const finished = new Promise<Result>((resolve, reject) => {
    finish = resolve;
    fail = reject;
  });
  const instance = autocannon({ timeout: 10, url: options.url, connections, duration: capS, requests: [request] }, (error, result) =>
    error ? fail(error) : finish(result),
  );
  const timers: NodeJS.Timeout[] = [];
  const wait = (ms: number) => new Promise<void>((resolve) => timers.push(setTimeout(resolve, ms)));

  instance.on("response", (client: object, statusCode: number, _bytes: number, responseTimeMs: number) => {
    if (!seenClients.has(client)) {
      seenClients.add(client);
      firstResponses.push(responseTimeMs);
    }
    if (lastTally < 0) return;
    const tally = tallies[lastTally]!;
    tally.latencies.push(responseTimeMs);
    const code = String(lastStatus || statusCode);
    tally.statusCodes[code] = (tally.statusCodes[code] ?? 0) + 1;
    if (Number(code) < 200 || Number(code) >= 300) tally.non2xx += 1;
  });

  const schedule = (async () => {
    // Warm-up: every connection answered and `warmupS` passed, then a second on each endpoint.
    while (firstResponses.length < connections || performance.now() - startedAt < options.warmupS * 1000) {
      if (performance.now() - startedAt > 60_000) throw new Error(`${options.url}: not every connection was answered within 60 s`);
      await wait(50);
    }
    for (const target of warmupTargets) {
      current = { target, tally: -1 };
      await wait(1000);
    }
    warmedAt = performance.now();
    const windows: { from: number; until: number }[] = [];
    for (let i = 0; i < measured.length; i++) {
      current = { target: measured[i]!, tally: -1 };
      await wait(settleS * 1000);
      const from = performance.now();
      current = { target: measured[i]!, tally: i };
      await wait(slotS * 1000);
      windows.push({ from, until: performance.now() });
    }
    current = { target: ceiling, tally: -1 };
    return windows;
  })();

  let windows: { from: number; until: number }[];
  try {
    windows = await schedule;
  } finally {
    instance.stop();
  }
  const result = await finished;
  for (const timer of timers) clearTimeout(timer);

  const rpsOf = (i: number) => tallies[i]!.latencies.length / ((windows[i]!.until - windows[i]!.from) / 1000);
  const cellOf = (indexes: number[]): Cell => {
    const latencies = indexes.flatMap((i) => tallies[i]!.latencies).sort((a, b) => a - b);
    const seconds = indexes.reduce((sum, i) => sum + (windows[i]!.until - windows[i]!.from) / 1000, 0);
    const statusCodes: Record<string, number> = {};
    for (const i of indexes) for (const [code, n] of Object.entries(tallies[i]!.statusCodes)) statusCodes[code] = (statusCodes[code] ?? 0) + n;
    return {
      connections,
      durationS: round(seconds, 1),
      requestsPerSecond: round(latencies.length / seconds, 1),
      latencyP50Ms: round(percentile(latencies, 0.5), 1),
      latencyP99Ms: round(percentile(latencies, 0.99), 1),
      latencyMaxMs: round(latencies.at(-1) ?? Number.NaN, 1),
      requests: latencies.length,
      // Connection errors and timeouts are the whole run's (autocannon does not say which request).
      errors: result.errors,
      timeouts: result.timeouts,
      non2xx: indexes.reduce((sum, i) => sum + tallies[i]!.non2xx, 0),
      statusCodes,
    };
  };
  const ceilingIndexes = measured.map((t, i) => (t === ceiling ? i : -1)).filter((i) => i >= 0);
  const byTarget = new Map<string, PairedCell>();
  for (const target of targets) {
    const indexes = measured.map((t, i) => (t === target ? i : -1)).filter((i) => i >= 0);
    const shares = indexes.map((i) => rpsOf(i) / ((rpsOf(i - 1) + rpsOf(i + 1)) / 2));
    byTarget.set(target.key, {
      ...cellOf(indexes),
      ceilingRequestsPerSecond: round(median(indexes.flatMap((i) => [rpsOf(i - 1), rpsOf(i + 1)])), 1),
      shareOfCeiling: round(median(shares), 3),
      shareByRound: shares.map((s) => round(s, 3)),
      requestsPerSecondByRound: indexes.map((i) => round(rpsOf(i), 1)),
    });
  }
  firstResponses.sort((a, b) => a - b);
  return {
    ceiling: { ...cellOf(ceilingIndexes), requestsPerSecondBySlot: ceilingIndexes.map((i) => round(rpsOf(i), 1)) },
    targets: byTarget,
    firstResponseOnNewConnection: { p50Ms: round(percentile(firstResponses, 0.5), 1), maxMs: round(firstResponses.at(-1) ?? Number.NaN, 1) },
    warmupS: round((warmedAt - startedAt) / 1000, 1),
  };
}
