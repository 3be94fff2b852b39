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
