// The few parts of autocannon's programmatic API the benchmarks use (the package ships no types).
declare module "autocannon" {
  interface Histogram {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    total: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    mismatches: number;
    resets: number;
    duration: number;
    "2xx": number;
    "4xx": number;
    "5xx": number;
    statusCodeStats: Record<string, { count: number }>;
  }
  interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    /** Called before each request is sent, with the connection's context; may change and return it. */
    setupRequest?: (request: Request, context: Record<string, unknown>) => Request;
    /** Called when its answer has arrived, with the same context, just before the "response" event. */
    onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: Request[];
    pipelining?: number;
  }
  /** A running load: emits "response" (client, statusCode, bytes, responseTimeMs) per answer. */
  interface Instance {
    on(event: "response", listener: (client: object, statusCode: number, bytes: number, responseTimeMs: number) => void): Instance;
    on(event: string, listener: (...args: unknown[]) => void): Instance;
    stop(): void;
  }
  function autocannon(options: Options): Promise<Result>;
  function autocannon(options: Options, done: (error: Error | null, result: Result) => void): Instance;
  export default autocannon;
  export type { Result, Options, Instance, Request };
}
