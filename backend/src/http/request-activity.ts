import type { NextFunction, Request, Response } from 'express';

/**
 * Whether this process is answering people right now: API requests in flight, and when the last
 * one ended. The embedded job runner asks it to leave one core to the web thread while readers
 * are active (issue 13: scans on every core made readers wait, even at a lower priority). Scan
 * workers' own result posts (worker token routes) are not readers and are not counted.
 */
class RequestActivity {
  private inFlight = 0;
  private lastEndedAt = -Infinity;

  readonly middleware = (req: Request, res: Response, next: NextFunction) => {
    if (req.path.startsWith('/worker/')) return next();
    this.inFlight += 1;
    let ended = false;
    const end = () => {
      if (ended) return;
      ended = true;
      this.inFlight -= 1;
      this.lastEndedAt = performance.now();
    };
    res.once('finish', end);
    res.once('close', end);
    next();
  };

  /** True while a request is being answered, or one ended less than `quietMs` ago. */
  busy(quietMs = 250): boolean {
    return this.inFlight > 0 || performance.now() - this.lastEndedAt < quietMs;
  }
}

/** One per process: the web thread and the embedded runner live in the same one. */
export const requestActivity = new RequestActivity();
