/** Running one autocannon cell and reducing its result to the figures the reports use. */
import autocannon, { type Options, type Result } from "autocannon";
import { round } from "./common";

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

/** A measured cell after a warm-up on the same connections, plus what the warm-up showed. */
export interface SteadyCell extends Cell {
  /** Seconds of warm-up actually run: at least the asked time, longer until every connection was answered. */
  warmupS: number;
  /**
   * The first answer on each newly opened connection, timed from its first request. When every
   * connection opens at once against a saturated server, the server takes them into its event
   * loop one at a time (see README, Performance), so these wait longest; they are reported here
   * and kept out of the steady-state figures above.
   */
  firstResponseOnNewConnection: { p50Ms: number; maxMs: number };
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

/**
 * One run in two phases on the same connections: at least `warmupS` seconds whose answers are not
 * counted (connections open and each is answered once, caches and the JIT warm up), then
 * `duration` seconds that are. Latency and
 * requests per second are for the measured phase only, as a load test of a
 * running service reads them; the first answer on every new connection is reported apart.
 */
export async function runSteady(options: Options & { connections: number; duration: number; warmupS: number }): Promise<SteadyCell> {
  const { warmupS, duration, ...rest } = options;
  const latencies: number[] = [];
  const firstResponses: number[] = [];
  const seenClients = new WeakSet<object>();
  let measuredFrom = Number.NaN;
  let measuredUntil = Number.NaN;
  const startedAt = performance.now();

  // The measured window opens once the warm-up time has passed and every connection has had its
  // first answer; autocannon is then stopped after `duration` seconds. The cap only guards a
  // server that never answers some connection.
  const capS = warmupS + duration + 60;
  let finish!: (result: Result) => void;
  let fail!: (error: unknown) => void;
  const finished = new Promise<Result>((resolve, reject) => {
    finish = resolve;
    fail = reject;
  });
  const instance = autocannon({ timeout: 10, ...rest, duration: capS }, (error, result) => (error ? fail(error) : finish(result)));
  let stopTimer: NodeJS.Timeout | undefined;
  instance.on("response", (client: object, _statusCode: number, _bytes: number, responseTimeMs: number) => {
    const now = performance.now();
    if (!seenClients.has(client)) {
      seenClients.add(client);
      firstResponses.push(responseTimeMs);
    }
    if (Number.isNaN(measuredFrom)) {
      if (firstResponses.length < options.connections || now - startedAt < warmupS * 1000) return;
      measuredFrom = now;
      stopTimer = setTimeout(() => instance.stop(), duration * 1000);
      return;
    }
    if (now - measuredFrom > duration * 1000) return;
    measuredUntil = now;
    latencies.push(responseTimeMs);
  });
  const result = await finished;
  clearTimeout(stopTimer);
  if (Number.isNaN(measuredFrom)) throw new Error(`${options.url}: not every connection was answered within ${capS} s`);

  latencies.sort((a, b) => a - b);
  firstResponses.sort((a, b) => a - b);
  const measuredS = Math.max(0.001, (measuredUntil - measuredFrom) / 1000);
  return {
    connections: options.connections,
    warmupS: round((measuredFrom - startedAt) / 1000, 1),
    durationS: duration,
    requestsPerSecond: round(latencies.length / measuredS, 1),
    latencyP50Ms: round(percentile(latencies, 0.5), 1),
    latencyP99Ms: round(percentile(latencies, 0.99), 1),
    latencyMaxMs: round(latencies.at(-1) ?? Number.NaN, 1),
    requests: latencies.length,
    // Errors, timeouts and status codes count over both phases: a failure while warming up is a failure.
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
    statusCodes: Object.fromEntries(Object.entries(result.statusCodeStats).map(([code, s]) => [code, s.count])),
    firstResponseOnNewConnection: { p50Ms: round(percentile(firstResponses, 0.5), 1), maxMs: round(firstResponses.at(-1) ?? Number.NaN, 1) },
  };
}
