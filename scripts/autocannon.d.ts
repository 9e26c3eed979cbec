// The parts of autocannon 9 (which ships no types) that scripts/load.ts and scripts/bench use.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  namespace autocannon {
    interface Histogram {
      average: number;
      total: number;
      mean: number;
      min: number;
      max: number;
      p50: number;
      p90: number;
      p97_5: number;
      p99: number;
    }
    interface Result {
      duration: number;
      errors: number;
      timeouts: number;
      non2xx: number;
      requests: Histogram;
      latency: Histogram;
      throughput: Histogram;
      statusCodeStats?: Record<string, { count: number }>;
    }
    interface Request {
      method?: string;
      path?: string;
      headers?: Record<string, string>;
      body?: string;
      setupRequest?: (request: Request, context: Record<string, unknown>) => Request | null;
      onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string>) => void;
    }
    interface Options {
      url: string;
      headers?: Record<string, string>;
      connections?: number;
      duration?: number;
      maxOverallRequests?: number;
      timeout?: number;
      requests?: Request[];
    }
    /** An event emitter that is also the promise of the result (when no callback is given). */
    interface Instance extends EventEmitter, Promise<Result> {
      on(event: 'done', listener: (result: Result) => void): this;
      on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): this;
      on(event: string, listener: (...args: unknown[]) => void): this;
    }
  }
  function autocannon(options: autocannon.Options): autocannon.Instance;
  export = autocannon;
}
