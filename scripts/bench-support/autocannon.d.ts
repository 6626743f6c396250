// The parts of autocannon's API the load benchmark uses (the package ships no types).
declare module "autocannon" {
  type Req = { method?: string; path?: string; headers?: Record<string, string>; body?: string | Buffer };
  type Context = Record<string, unknown>;
  export type Request = Req & {
    setupRequest?: (req: Req, context: Context) => Req | null;
    onResponse?: (status: number, body: string, context: Context) => void;
  };
  export type Histogram = { average: number; mean: number; stddev: number; min: number; max: number; p50: number; p90: number; p97_5: number; p99: number };
  export type Result = {
    requests: Histogram & { total: number; sent: number };
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    "2xx": number;
    duration: number;
    statusCodeStats: Record<string, { count: number }>;
  };
  export default function autocannon(options: {
    url: string;
    connections?: number;
    duration?: number;
    timeout?: number;
    headers?: Record<string, string>;
    requests?: Request[];
  }): Promise<Result>;
}
