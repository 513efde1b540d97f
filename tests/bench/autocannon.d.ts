// The few parts of autocannon@9 the board bench uses (the package ships no types).
declare module 'autocannon' {
  interface Options {
    url: string
    connections?: number
    duration?: number
    headers?: Record<string, string>
  }
  interface Histogram {
    average: number
    p50: number
    p90: number
    p97_5: number
    p99: number
    max: number
  }
  interface Result {
    requests: Histogram & { total: number }
    latency: Histogram
    throughput: Histogram
    errors: number
    non2xx: number
  }
  interface Instance extends PromiseLike<Result> {
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): this
  }
  function autocannon(options: Options): Instance
  export default autocannon
}
