// The root route's middleware: every request to every route (pages, their data requests,
// actions, resource routes and the API) passes through these, in this order.
import { data, type MiddlewareFunction } from "react-router";
import { checkRequestBounds } from "./request-bounds.server";
import { nonceContext } from "./request-context.server";
import { inRequestScope } from "./request-scope.server";
import { checkSameOrigin } from "./same-origin.server";
import { applySecurityHeaders, newNonce } from "./security-headers.server";

/** Machine callers get JSON; people get the app's error page with the message. */
const isMachineRoute = (url: URL) => /^\/(api|webhooks)\//.test(url.pathname);

function refuse(request: Request, status: number, message: string): Response {
  const url = new URL(request.url);
  if (isMachineRoute(url)) return Response.json({ error: "refused", message, fieldErrors: {} }, { status });
  throw data({ message }, { status });
}

const securityHeaders: MiddlewareFunction<Response> = async ({ request, context }, next) => {
  const nonce = newNonce();
  context.set(nonceContext, nonce);
  const response = await next();
  return applySecurityHeaders(response, { nonce, withCookie: request.headers.has("Cookie") });
};

/** A cross-site state change, or a request too large or oddly shaped, never reaches a route. */
const guardRequest: MiddlewareFunction<Response> = async ({ request }, next) => {
  const problem = checkSameOrigin(request) ?? (await checkRequestBounds(request));
  if (problem) return refuse(request, problem.status, problem.message);
  return next();
};

/** What a reading request works out once (its user, its session) is shared by all its loaders. */
const requestScope: MiddlewareFunction<Response> = ({ request }, next) => inRequestScope(request, next);

export const rootMiddleware = [requestScope, securityHeaders, guardRequest];
