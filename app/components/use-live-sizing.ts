import { useEffect, useRef, useState } from "react";
import type { Design } from "~/hydraulics";

export type LiveSizingState =
  | { status: "ready"; design: Design | null; fieldErrors: Record<string, string[]>; message: null }
  | { status: "sizing"; design: Design | null; fieldErrors: Record<string, string[]>; message: null }
  | { status: "invalid"; design: Design | null; fieldErrors: Record<string, string[]>; message: string | null }
  | { status: "failed"; design: Design | null; fieldErrors: Record<string, string[]>; message: string };

/**
 * Sizes the circuit through the public API while the person types: one request per pause
 * (debounced), earlier requests cancelled, the last good design kept on screen when the
 * current input has a problem.
 */
export function useLiveSizing(input: Record<string, unknown>, initial: { design: Design | null; fieldErrors: Record<string, string[]> }, delayMs = 350) {
  const [state, setState] = useState<LiveSizingState>({ status: "ready", message: null, ...initial });
  const body = JSON.stringify(input);
  const first = useRef(true);

  useEffect(() => {
    // The server already sized what the page was rendered with (when it had a design).
    if (first.current) {
      first.current = false;
      if (initial.design) return;
    }
    const controller = new AbortController();
    setState((s) => ({ ...s, status: "sizing", message: null }) as LiveSizingState);
    const timer = setTimeout(async () => {
      try {
        const response = await fetch("/api/v1/sizing", {
          method: "POST",
          headers: { "Content-Type": "application/json" },
          body,
          signal: controller.signal,
        });
        const payload = await response.json();
        if (response.ok) setState({ status: "ready", design: payload as Design, fieldErrors: {}, message: null });
        else if (response.status === 400)
          setState((s) => ({ status: "invalid", design: s.design, fieldErrors: payload.fieldErrors ?? {}, message: payload.fieldErrors?._form?.[0] ?? null }));
        else setState((s) => ({ status: "failed", design: s.design, fieldErrors: {}, message: payload.message ?? "Sizing is not available right now." }));
      } catch (error) {
        if ((error as Error).name === "AbortError") return;
        setState((s) => ({ status: "failed", design: s.design, fieldErrors: {}, message: "Tenderflow could not be reached. Check your connection." }));
      }
    }, delayMs);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the first design only matters once
  }, [body, delayMs]);

  return state;
}
