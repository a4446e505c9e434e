import { useEffect, useRef, useState } from "react";
import type { UnitSystem } from "~/units";
import { CircuitDiagram, diagramWidth, type DiagramSubject } from "./circuit-diagram";
import { Button } from "./ui";

const ZOOMS = [1, 1.5, 2, 3] as const;

/** An axis's design, or a circuit (a machine's: `circuit={machineDesign.circuit}`), in the reader's units. */
export type CircuitViewerProps = DiagramSubject & { units: UnitSystem };

/** An axis is drawn 760 units wide: zoom 1 fits a desk screen. */
const AXIS_WIDTH = 760;

/**
 * The circuit diagram with a way to read it on a small screen: "Open larger" shows it on its own
 * over the page, where it can be zoomed and scrolled (pinch-zoom works too). The large copy is
 * drawn only while open. A machine's wider drawing scrolls sideways on the page rather than
 * shrinking its labels below what can be read.
 */
export function CircuitViewer(props: CircuitViewerProps) {
  const { units } = props;
  const what: DiagramSubject = props.design ? { design: props.design } : { circuit: props.circuit };
  const width = diagramWidth(props.design ? props.design.circuit : props.circuit);
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
      {width > AXIS_WIDTH ? (
        <div className="overflow-x-auto" data-diagram-scroll="">
          {/* at most a quarter smaller than an axis shown full width */}
          <div style={{ minWidth: `${Math.round(width * 0.75)}px` }}>
            <CircuitDiagram {...what} units={units} />
          </div>
        </div>
      ) : (
        <CircuitDiagram {...what} units={units} />
      )}
      <p className="mt-2 flex flex-wrap items-center justify-end gap-x-3 gap-y-1">
        {width > AXIS_WIDTH ? <span className="mr-auto text-xs text-ink-600">Wider than the page: scroll sideways to see every axis.</span> : null}
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
              {/* one unit of the drawing is one pixel at zoom 1 */}
              <div style={{ width: `${Math.round(Math.max(width, AXIS_WIDTH) * zoom)}px` }}>
                <CircuitDiagram {...what} units={units} />
              </div>
            </div>
          </div>
        ) : null}
      </dialog>
    </>
  );
}
