// The few parts of autocannon's API the bench uses (the package ships no types).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  interface Histogram {
    p50: number;
    p97_5: number;
    p99: number;
    average: number;
    total: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
  }
  interface Request {
    method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    /** Called before each send; returns the request to send. */
    setupRequest?: (request: Request, context: object) => Request;
    onResponse?: (status: number, body: string, context: object) => void;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    /**
     * Requests per second from all connections together. Not an even open-loop load: each
     * connection sends its share when a one-second timer resets, all connections at once.
     */
    overallRate?: number;
    headers?: Record<string, string>;
    requests?: Request[];
  }
  interface Instance extends EventEmitter, PromiseLike<Result> {
    on(
      event: 'response',
      listener: (client: unknown, status: number, bytes: number, time: number) => void,
    ): this;
  }
  export default function autocannon(options: Options): Instance;
}
