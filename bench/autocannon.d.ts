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
    headers?: Record<string, string>;
    requests?: Request[];
  }
  interface Histogram {
    average: number;
    p50: number;
    p99: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    '2xx': number;
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  function autocannon(options: Options): Promise<Result>;
  namespace autocannon {
    export type { Result };
  }
  export default autocannon;
}
