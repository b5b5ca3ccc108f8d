import { Server, type IncomingMessage, type ServerResponse } from 'node:http';
import { monitorEventLoopDelay, type IntervalHistogram } from 'node:perf_hooks';

/**
 * Loaded into the benchmarked server process only (`node --import tsx --import
 * tests/bench/server-probe.ts …`, by `npm run bench:load`); the server itself has no such code
 * and no route for it. Over the IPC channel the bench opened it measures, from the bench's
 * 'start' message on:
 *  - the web thread's event-loop delay (perf_hooks.monitorEventLoopDelay, 10 ms resolution),
 *    over the whole run and per second;
 *  - each request's in-server time: from the moment Node hands the parsed request to the app
 *    ('request' event) to the end of its response ('finish'). Time spent queued before the
 *    web thread got to the request is not in it; that is what the bench's own latency adds.
 * 'report' is answered with everything measured, as JSON-friendly numbers.
 */
export interface ProbeReport {
  loop: { p50: number; p99: number; max: number; mean: number };
  /** Per whole second since 'start': the event loop's p99 and max delay, ms. */
  loopPerSecond: { p99: number; max: number }[];
  /** Every request answered since 'start': its path, when it arrived (ms since 'start') and its in-server time (ms). */
  requests: { path: string; atMs: number; ms: number }[];
}

type ProbeMessage = { probe: 'start' } | { probe: 'report' };

const ns = (h: IntervalHistogram, q?: number) => Number(((q === undefined ? h.max : h.percentile(q)) / 1e6).toFixed(2));

if (process.send) {
  let startedAt: number | null = null;
  const whole = monitorEventLoopDelay({ resolution: 10 });
  const second = monitorEventLoopDelay({ resolution: 10 });
  const loopPerSecond: ProbeReport['loopPerSecond'] = [];
  const requests: ProbeReport['requests'] = [];
  let tick: NodeJS.Timeout | null = null;

  const emit = Server.prototype.emit;
  Server.prototype.emit = function (this: Server, event: string | symbol, ...args: unknown[]) {
    if (event === 'request' && startedAt !== null) {
      const [req, res] = args as [IncomingMessage, ServerResponse];
      const arrived = performance.now();
      // Read now: Express rewrites req.url while routing through mounted routers.
      const path = req.url ?? '';
      res.once('finish', () => requests.push({ path, atMs: Number((arrived - startedAt!).toFixed(1)), ms: Number((performance.now() - arrived).toFixed(2)) }));
    }
    return emit.apply(this, [event, ...args] as Parameters<typeof emit>);
  } as typeof Server.prototype.emit;

  process.on('message', (message: ProbeMessage) => {
    if (message.probe === 'start') {
      startedAt = performance.now();
      whole.enable();
      second.enable();
      tick = setInterval(() => {
        loopPerSecond.push({ p99: ns(second, 99), max: ns(second) });
        second.reset();
      }, 1000);
      tick.unref();
    } else if (message.probe === 'report') {
      if (tick) clearInterval(tick);
      whole.disable();
      second.disable();
      const report: ProbeReport = { loop: { p50: ns(whole, 50), p99: ns(whole, 99), max: ns(whole), mean: Number((whole.mean / 1e6).toFixed(2)) }, loopPerSecond, requests };
      process.send!(report);
    }
  });
  // The IPC channel must not keep the server alive on its own.
  process.channel?.unref();
}
