import http from 'node:http';
import type { Express } from 'express';

/**
 * A constructor that builds `Base` objects whose prototype is `proto` from the start: `new Sub()`
 * creates the object from Sub's own map (prototype = proto), and Base's constructor, called on
 * it, initialises it as a Base. Node's IncomingMessage and ServerResponse are plain constructor
 * functions, so they can be called this way. (`Reflect.construct(Base, args, Sub)` gives the
 * same objects, but measured here it let them outlive young collections again: 0.4 MB/s promoted
 * for a bare server where this form promotes none.)
 */
function withPrototype<T extends Function>(Base: T, proto: object): T {
  function Sub(this: object, ...args: unknown[]) {
    Base.apply(this, args);
  }
  Sub.prototype = proto;
  return Sub as unknown as T;
}

/**
 * The HTTP server for the app, whose requests and responses are born with Express's own
 * prototypes (`app.request`, `app.response`, themselves built on Node's).
 *
 * Express gives every request and response its prototypes with `Object.setPrototypeOf` as they
 * come in. Done to objects already created, it cost far more than the call: at 300 requests/s a
 * fifth of everything this app allocated outlived the young-generation collections into the old
 * generation (~9.5 MB/s), so full mark-compacts came every few seconds and the slow requests
 * clustered around them. (Why V8 keeps those objects that long we did not trace; the effect was
 * measured with --trace-gc-nvp.) With the prototype right from the start, Express's
 * `setPrototypeOf` finds it already set and changes nothing (the spec's SameValue check):
 * measured 9.5 → 1.3 MB/s for this app, 2.5 → 0 MB/s for a bare Express app. Node's
 * `createServer` takes the two constructors for this purpose (options IncomingMessage and
 * ServerResponse).
 */
export function createHttpServer(app: Express): http.Server {
  return http.createServer(
    {
      IncomingMessage: withPrototype(http.IncomingMessage, app.request),
      ServerResponse: withPrototype(http.ServerResponse, app.response),
    },
    app,
  );
}
