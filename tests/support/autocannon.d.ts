// The parts of autocannon 9's programmatic API the load benchmark uses (the package ships no types).
declare module 'autocannon' {
  namespace autocannon {
    interface Histogram {
      average: number;
      mean: number;
      stddev: number;
      min: number;
      max: number;
      p50: number;
      p90: number;
      p97_5: number;
      p99: number;
    }
    interface Result {
      requests: Histogram & { total: number; sent: number };
      latency: Histogram;
      throughput: Histogram;
      errors: number;
      timeouts: number;
      non2xx: number;
      '2xx': number;
      duration: number;
    }
    interface Request {
      method?: string;
      path?: string;
      headers?: Record<string, string>;
      body?: string | Buffer;
      setupRequest?: (req: Request, context: Record<string, unknown>) => Request | null | undefined;
      onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string>) => void;
    }
    interface Options {
      url: string;
      connections?: number;
      duration?: number;
      amount?: number;
      headers?: Record<string, string>;
      method?: string;
      body?: string;
      requests?: Request[];
      timeout?: number;
    }
  }
  function autocannon(options: autocannon.Options): Promise<autocannon.Result>;
  export default autocannon;
}
