import { useEffect, useRef, useState } from "react";
import type { Design } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { CircuitDiagram } from "./circuit-diagram";
import { Button } from "./ui";

const ZOOMS = [1, 1.5, 2, 3] as const;

/**
 * The circuit diagram with a way to read it on a small screen: "Open larger" shows it on its own
 * over the page, where it can be zoomed and scrolled (pinch-zoom works too). The large copy is
 * drawn only while open.
 */
export function CircuitViewer({ design, units }: { design: Design; units: UnitSystem }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [open, setOpen] = useState(false);
  const [zoom, setZoom] = useState<(typeof ZOOMS)[number]>(2);
  useEffect(() => {
    const d = dialog.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <>
      <CircuitDiagram design={design} units={units} />
      <p className="mt-2 flex justify-end">
        <Button type="button" tone="quiet" onClick={() => setOpen(true)} aria-haspopup="dialog">
          Open the diagram larger
        </Button>
      </p>
      <dialog
        ref={dialog}
        onClose={() => setOpen(false)}
        aria-label="Circuit diagram, larger"
        className="m-0 h-full max-h-none w-full max-w-none bg-white p-0 backdrop:bg-ink-900/60 sm:m-auto sm:h-[92vh] sm:w-[94vw] sm:rounded-lg"
      >
        {open ? (
          <div className="flex h-full flex-col">
            <div className="flex flex-wrap items-center gap-2 border-b border-ink-100 px-3 py-2">
              <span className="text-sm font-semibold text-ink-800">Zoom</span>
              {ZOOMS.map((z) => (
                <button
                  key={z}
                  type="button"
                  onClick={() => setZoom(z)}
                  aria-pressed={zoom === z}
                  className="rounded-md px-2 py-1 text-sm ring-1 ring-ink-200 aria-pressed:bg-flow-600 aria-pressed:text-white"
                >
                  {z * 100} %
                </button>
              ))}
              <Button type="button" tone="secondary" className="ml-auto" onClick={() => setOpen(false)}>
                Close
              </Button>
            </div>
            <div className="flex-1 overflow-auto" data-diagram-zoom={zoom}>
              {/* 760 units is the drawing's usual width: zoom 1 fits a desk screen. */}
              <div style={{ width: `${Math.round(760 * zoom)}px` }}>
                <CircuitDiagram design={design} units={units} />
              </div>
            </div>
          </div>
        ) : null}
      </dialog>
    </>
  );
}
