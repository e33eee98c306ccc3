import type { Request, RequestHandler, Response } from 'express';

/**
 * Several middlewares run one after another as one: mounted once, a request walks one router layer
 * (its path matched and its prefix trimmed once) instead of one per middleware. An error passed to
 * `next`, thrown or rejected, leaves the chain for the app's error handler, as it would between layers.
 */
export function inTurn(handlers: RequestHandler[]): RequestHandler {
  return (req, res, next) => {
    let i = 0;
    const step = (err?: unknown): void => {
      if (err !== undefined && err !== null) return next(err);
      const handler = handlers[i++];
      if (!handler) return next();
      try {
        // As Express 5 does for a layer, a handler's rejected promise is an error passed on.
        const result: unknown = handler(req, res, step);
        if (result instanceof Promise) result.catch(next);
      } catch (thrown) {
        next(thrown);
      }
    };
    step();
  };
}

/**
 * A middleware that only sets response headers fixed by its options (helmet's, whose policies here
 * name no per-request value), worked out once at start and then set on each response in one loop.
 * Throws at start if the middleware turns out to read the request or to do anything else.
 */
export function fixedHeaders(middleware: RequestHandler): RequestHandler {
  const set: Array<[string, string | number | readonly string[]]> = [];
  const removed: string[] = [];
  let passed = false;
  const refuse = () => {
    throw new Error('fixedHeaders: the middleware did more than set headers');
  };
  const req = new Proxy({}, { get: refuse }) as Request;
  const res = {
    setHeader: (name: string, value: string | number | readonly string[]) => void set.push([name, value]),
    removeHeader: (name: string) => void removed.push(name),
  } as unknown as Response;
  void middleware(req, new Proxy(res, { get: (target, key) => (key in target ? target[key as keyof Response] : refuse()) }), () => {
    passed = true;
  });
  if (!passed) throw new Error('fixedHeaders: the middleware did not pass the request on');
  return (_req, response, next) => {
    for (const name of removed) response.removeHeader(name);
    for (const [name, value] of set) response.setHeader(name, value);
    next();
  };
}
