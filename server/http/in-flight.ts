import type { RequestHandler } from 'express';

export interface InFlightRequests {
  /** Counts a request from its arrival until its reply is handed to the socket. */
  middleware: RequestHandler;
  /** Requests whose handlers are still running. */
  count(): number;
  /**
   * Resolves when no handler is running any more, or after `timeoutMs` (the pools are
   * then closed under the stragglers). Resolves true when everything drained.
   */
  drained(timeoutMs: number): Promise<boolean>;
}

/**
 * Keeps count of the requests whose handlers are still at work. A closed HTTP server
 * only says that its sockets are gone; a request whose client hung up (a load test
 * stopping, a browser tab closed) still runs its handler, reads its session and writes
 * its reply to nothing. Shutdown waits for this count to reach zero before it ends the
 * session and data pools, so no handler meets an ended pool.
 *
 * The middleware goes first, so its res.end is the innermost: it runs after the session
 * middleware's own res.end wrapper has written the session, i.e. when the request has
 * used its last connection.
 */
export function trackInFlight(): InFlightRequests {
  let open = 0;
  let waiters: (() => void)[] = [];
  const settle = () => {
    open -= 1;
    if (open === 0) {
      const done = waiters;
      waiters = [];
      for (const resolve of done) resolve();
    }
  };
  return {
    middleware: (_req, res, next) => {
      open += 1;
      let finished = false;
      const end = res.end.bind(res) as (...args: unknown[]) => typeof res;
      res.end = ((...args: unknown[]) => {
        if (!finished) {
          finished = true;
          settle();
        }
        return end(...args);
      }) as typeof res.end;
      next();
    },
    count: () => open,
    drained: (timeoutMs) => {
      if (open === 0) return Promise.resolve(true);
      return new Promise<boolean>((resolve) => {
        const timer = setTimeout(() => {
          waiters = waiters.filter((waiter) => waiter !== onDrained);
          resolve(false);
        }, timeoutMs);
        timer.unref();
        const onDrained = () => {
          clearTimeout(timer);
          resolve(true);
        };
        waiters.push(onDrained);
      });
    },
  };
}
