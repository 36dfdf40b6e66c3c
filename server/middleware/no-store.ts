import type { RequestHandler } from "express";

/**
 * Answers to a signed-in request (VINs, prices, buyers' details) are never stored by a browser or a proxy. Set as the
 * headers go out, so no route's own Cache-Control (a public route a staff member happens to call) can undo it.
 * Mounted after the session is read; requests without a session keep the caching their routes give them.
 */
export const noStoreWhenSignedIn: RequestHandler = (_req, res, next) => {
  if (res.locals.auth) {
    const writeHead = res.writeHead.bind(res);
    res.writeHead = ((...args: Parameters<typeof res.writeHead>) => {
      res.setHeader("Cache-Control", "no-store");
      return writeHead(...args);
    }) as typeof res.writeHead;
  }
  next();
};
