// The few parts of autocannon's API the bench uses (the package ships no types).
declare module 'autocannon' {
  interface Histogram {
    p50: number;
    p99: number;
    average: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    errors: number;
    non2xx: number;
  }
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
  }
  export default function autocannon(options: Options): Promise<Result>;
}
