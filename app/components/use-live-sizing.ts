import { useEffect, useRef, useState } from "react";
import type { Design } from "~/hydraulics";

type Errors = Record<string, string[]>;

export type LiveSizingState<D = Design> =
  | { status: "ready"; design: D | null; fieldErrors: Errors; message: null }
  | { status: "sizing"; design: D | null; fieldErrors: Errors; message: null }
  | { status: "invalid"; design: D | null; fieldErrors: Errors; message: string | null }
  | { status: "failed"; design: D | null; fieldErrors: Errors; message: string };

/** The public sizing endpoints: one axis, or a machine of several axes. */
export const AXIS_SIZING_URL = "/api/v1/sizing";
export const MACHINE_SIZING_URL = "/api/v1/machines/sizing";

/**
 * Sizes the circuit through the public API while the person types: one request per pause
 * (debounced), earlier requests cancelled, the last good design kept on screen when the
 * current input has a problem. Asking another endpoint (an axis becomes a machine) starts
 * afresh, so a design of one kind is never shown as the other.
 */
export function useLiveSizing<D = Design>(
  input: Record<string, unknown>,
  initial: { design: D | null; fieldErrors: Errors },
  delayMs = 350,
  url: string = AXIS_SIZING_URL,
): LiveSizingState<D> {
  const [state, setState] = useState<LiveSizingState<D> & { url: string }>({ status: "ready", message: null, url, ...initial });
  const body = JSON.stringify(input);
  const first = useRef(true);

  useEffect(() => {
    // The server already sized what the page was rendered with (when it had a design).
    if (first.current) {
      first.current = false;
      if (initial.design) return;
    }
    const controller = new AbortController();
    const kept = (s: { design: D | null; url: string }) => (s.url === url ? s.design : null);
    setState((s) => ({ ...s, status: "sizing", message: null, design: kept(s), fieldErrors: s.url === url ? s.fieldErrors : {}, url }));
    const timer = setTimeout(async () => {
      try {
        const response = await fetch(url, {
          method: "POST",
          headers: { "Content-Type": "application/json" },
          body,
          signal: controller.signal,
        });
        const payload = await response.json();
        if (response.ok) setState({ status: "ready", design: payload as D, fieldErrors: {}, message: null, url });
        else if (response.status === 400)
          setState((s) => ({
            status: "invalid",
            design: kept(s),
            fieldErrors: payload.fieldErrors ?? {},
            message: payload.fieldErrors?._form?.[0] ?? null,
            url,
          }));
        else setState((s) => ({ status: "failed", design: kept(s), fieldErrors: {}, message: payload.message ?? "Sizing is not available right now.", url }));
      } catch (error) {
        if ((error as Error).name === "AbortError") return;
        setState((s) => ({ status: "failed", design: kept(s), fieldErrors: {}, message: "Tenderflow could not be reached. Check your connection.", url }));
      }
    }, delayMs);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the first design only matters once
  }, [body, delayMs, url]);

  return state.url === url ? state : { ...state, design: null, fieldErrors: {} };
}
