// Values worked out once per HTTP request. React Router hands each loader its own copy of the
// Request, so a memo keyed by the Request object misses between the root loader and the page's:
// the root middleware opens a scope for the whole request instead, and the memo lives there.
import { AsyncLocalStorage } from "node:async_hooks";

const scope = new AsyncLocalStorage<Map<symbol | string, unknown>>();

/**
 * Runs a reading request (GET, HEAD) in a scope of its own. A state change gets none: its
 * action may change what the loaders after it read (a renamed user, a popped toast).
 */
export function inRequestScope<T>(request: Request, next: () => Promise<T>): Promise<T> {
  return request.method === "GET" || request.method === "HEAD" ? scope.run(new Map(), next) : next();
}

// Outside a scope (an action, or a test calling a loader itself): one memo per Request object.
const perRequestObject = new WeakMap<Request, Map<symbol | string, unknown>>();

/** `compute()` once for this request and `key`; every later ask gets the same value (a promise, say). */
export function oncePerRequest<T>(key: symbol, request: Request, compute: () => T): T {
  let memo = scope.getStore();
  if (!memo) {
    memo = perRequestObject.get(request) ?? new Map();
    perRequestObject.set(request, memo);
  }
  return remembered(memo, key, compute);
}

/**
 * A record a reading request loads more than once (the spec its loaders each check access to):
 * read once in a reading request's scope, every time elsewhere. `key` names the record and who
 * reads it, since the access policy decides what a reader gets.
 */
export function readOncePerRequest<T>(key: string, read: () => Promise<T>): Promise<T> {
  const memo = scope.getStore();
  // A string key of its own kind: the symbols of oncePerRequest can never equal it.
  return memo ? remembered(memo, key, read) : read();
}

function remembered<T>(memo: Map<symbol | string, unknown>, key: symbol | string, compute: () => T): T {
  if (!memo.has(key)) memo.set(key, compute());
  return memo.get(key) as T;
}
