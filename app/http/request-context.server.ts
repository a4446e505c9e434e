// Values the server hands to every request through React Router's context.
import { createContext } from "react-router";

/** The nonce that marks this response's own inline scripts for the content security policy. */
export const nonceContext = createContext<string>("");

/**
 * The client's address as the HTTP server saw it, with X-Forwarded-For honoured only from the
 * proxies named in TRUSTED_PROXIES (app/serve.server.ts). Null under the Vite dev server.
 */
export const clientAddressContext = createContext<string | null>(null);
