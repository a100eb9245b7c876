// The part of autocannon's API bench/api.ts uses (the package ships no types).
declare module 'autocannon' {
  interface RawRequest {
    method?: string;
    path?: string;
    body?: string;
    headers?: Record<string, string>;
  }
  interface Request extends RawRequest {
    setupRequest?: (req: RawRequest, context: Record<string, unknown>) => RawRequest;
    onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    /** a fixed number of requests instead of a duration */
    amount?: number;
    headers?: Record<string, string>;
    requests?: Request[];
  }
  interface Histogram {
    average: number;
    p50: number;
    p99: number;
  }
  interface Result {
    /** per-second samples; `total` counts the completed requests */
    requests: Histogram & { total: number };
    latency: Histogram;
    '2xx': number;
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  function autocannon(options: Options): Promise<Result>;
  namespace autocannon {
    export type { Options, RawRequest, Result };
  }
  export default autocannon;
}
