/** The part of autocannon's programmatic API the load benchmark uses (the package ships no types). */
declare module "autocannon" {
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    headers?: Record<string, string>;
  }
  interface Histogram {
    average: number;
    p50: number;
    p99: number;
  }
  interface Result {
    requests: Histogram;
    latency: Histogram;
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  function autocannon(options: Options): Promise<Result>;
  export default autocannon;
}
