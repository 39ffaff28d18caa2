// The part of autocannon 9's API the benchmarks use (the package ships no types).
declare module "autocannon" {
  import type { EventEmitter } from "node:events";

  export interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (req: Request, context: Record<string, unknown>) => Request;
  }
  export interface Options {
    url: string;
    connections?: number;
    amount?: number;
    duration?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    requests?: Request[];
  }
  export interface Histogram {
    average: number;
    mean: number;
    p50: number;
    p90: number;
    p99: number;
    max: number;
  }
  export interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    "2xx": number;
    duration: number;
  }
  export interface Instance extends EventEmitter, PromiseLike<Result> {
    stop(): void;
  }
  function autocannon(options: Options): Instance;
  export default autocannon;
}
