// The part of autocannon 9's programmatic API the API benchmark uses (the package ships no types).
declare module 'autocannon' {
  namespace autocannon {
    interface Histogram { p50: number; p90: number; p99: number; average: number; max: number }
    interface Result { latency: Histogram; requests: Histogram & { total: number }; non2xx: number; errors: number; timeouts: number }
    interface Request { path?: string; method?: string; headers?: Record<string, string> }
    interface Options {
      url: string; connections?: number; duration?: number; timeout?: number; headers?: Record<string, string>;
      /** Cycled through per connection; setupRequest may rewrite each one before it is sent. */
      requests?: (Request & { setupRequest?: (req: Request) => Request })[];
    }
  }
  function autocannon(opts: autocannon.Options, cb: (err: Error | null, result: autocannon.Result) => void): unknown;
  export = autocannon;
}
