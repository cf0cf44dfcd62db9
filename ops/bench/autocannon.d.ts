/** The part of autocannon 9's programmatic API the load benchmark uses (it ships no types). */
declare module 'autocannon' {
  interface Histogram {
    average: number
    mean: number
    stddev: number
    min: number
    max: number
    total: number
    p2_5: number
    p50: number
    p97_5: number
    p99: number
  }
  interface Request {
    method?: string
    path: string
    headers?: Record<string, string>
  }
  interface Options {
    url: string
    connections?: number
    duration?: number
    pipelining?: number
    timeout?: number
    headers?: Record<string, string>
    requests?: Request[]
  }
  interface Result {
    requests: Histogram
    latency: Histogram
    throughput: Histogram
    duration: number
    errors: number
    timeouts: number
    non2xx: number
    '1xx': number
    '2xx': number
    '3xx': number
    '4xx': number
    '5xx': number
    statusCodeStats: Record<string, { count: number }>
  }
  function autocannon(opts: Options): Promise<Result>
  export default autocannon
}
