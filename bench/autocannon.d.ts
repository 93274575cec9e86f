// The part of autocannon 9's API that bench/http.ts uses (the package ships no type declarations).
declare module 'autocannon' {
  interface Histogram { average: number; mean: number; p50: number; p99: number; max: number; total: number }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  interface Options {
    url: string;
    method?: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
    body?: string;
    requests?: Array<{ setupRequest?: (req: { body?: string }) => { body?: string } }>;
  }
  function autocannon(opts: Options): Promise<Result>;
  export default autocannon;
}
