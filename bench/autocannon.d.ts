// Minimal types for the parts of autocannon 9 that bench/load.ts uses (the package ships none).
declare module 'autocannon' {
  interface Histogram {
    average: number
    p50: number
    p99: number
  }
  interface Options {
    url: string
    method?: string
    body?: string
    headers?: Record<string, string>
    connections?: number
    duration?: number
  }
  interface Result {
    /** Per-second request counts; `total`: responses received in the run. */
    requests: Histogram & { total: number }
    latency: Histogram
    non2xx: number
    errors: number
    timeouts: number
  }
  function autocannon(options: Options): Promise<Result>
  export default autocannon
}
