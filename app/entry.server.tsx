import { Writable } from "node:stream";
import type { EntryContext, RouterContextProvider } from "react-router";
import { ServerRouter } from "react-router";
import { renderToPipeableStream } from "react-dom/server";
import { env } from "~/env.server";
import { nonceContext } from "~/http/request-context.server";
import { keepStartingBackgroundWork } from "~/services/background-work.server";

// Checked when the server starts, not on the first request: a bad setting stops it with a message.
const settings = env();
// Each app server process runs the background work (mail, schedules) on pg-boss, which runs each
// job once across all of them. Kept on globalThis so the dev server's reloads start it once. Tests
// run what they need themselves.
const running = globalThis as unknown as { __tenderflowBackgroundWork?: Promise<() => Promise<void>> };
if (settings.NODE_ENV !== "test") running.__tenderflowBackgroundWork ??= keepStartingBackgroundWork();

/** Stops the background work cleanly (app/serve.server.ts calls it on Ctrl-C or SIGTERM). */
export async function stopBackgroundWork() {
  const stop = await running.__tenderflowBackgroundWork;
  delete running.__tenderflowBackgroundWork;
  await stop?.();
}

export const streamTimeout = 5_000;

export default function handleRequest(
  request: Request,
  responseStatusCode: number,
  responseHeaders: Headers,
  routerContext: EntryContext,
  loadContext: RouterContextProvider,
) {
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, { status: responseStatusCode, headers: responseHeaders });
  }

  return new Promise<Response>((resolve, reject) => {
    let shellRendered = false;
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);

    // The root middleware made this response's nonce (none under the dev server); React Router
    // puts it on its inline scripts.
    const nonce = loadContext.get(nonceContext) || undefined;
    // Every reader gets the whole document in one piece: no page waits for data after its shell
    // (the loaders have it all), so streaming bought nothing but the work of passing React's 2 kB
    // chunks through a Node stream, a web stream and Express (DEVELOPERS.md, "Pages are sent whole").
    const { pipe, abort } = renderToPipeableStream(<ServerRouter context={routerContext} url={request.url} nonce={nonce} />, {
      nonce,
      // A finished Suspense boundary (a part loaded later, components/loaded-later.tsx) stays in
      // place however large: React would otherwise send one over 12.8 kB after the shell, revealed
      // by a script, and a browser without JavaScript would show its placeholder.
      progressiveChunkSize: Number.POSITIVE_INFINITY,
      onShellReady() {
        shellRendered = true;
      },
      onAllReady() {
        const chunks: Buffer[] = [];
        const html = new Writable({
          write(chunk: Buffer, _encoding, callback) {
            chunks.push(chunk);
            callback();
          },
          final(callback) {
            clearTimeout(timeoutId);
            timeoutId = undefined;
            responseHeaders.set("Content-Type", "text/html");
            resolve(new Response(Buffer.concat(chunks), { headers: responseHeaders, status: responseStatusCode }));
            callback();
          },
        });
        pipe(html);
      },
      onShellError(error: unknown) {
        reject(error);
      },
      onError(error: unknown) {
        responseStatusCode = 500;
        if (shellRendered) console.error(error);
      },
    });
  });
}

// app/serve.server.ts sets the client's address under this key (keys compare by identity).
export { clientAddressContext } from "~/http/request-context.server";
