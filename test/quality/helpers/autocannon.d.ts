/** The part of autocannon 9's API (it ships no types) that the load benchmarks use. */
declare module 'autocannon' {
  namespace autocannon {
    interface Options {
      url: string;
      method?: string;
      headers?: Record<string, string>;
      body?: string;
      connections?: number;
      duration?: number;
    }
    interface Histogram {
      min: number;
      max: number;
      average: number;
      p50: number;
      p99: number;
      total: number;
    }
    interface Result {
      requests: Histogram;
      latency: Histogram;
      errors: number;
      timeouts: number;
      non2xx: number;
    }
  }
  function autocannon(options: autocannon.Options): Promise<autocannon.Result>;
  export default autocannon;
}
