import { lazy, Suspense, useState, type ComponentType, type ReactNode } from "react";
import { Card } from "./ui";

// The parts of the intake form and quick sizing that draw a design (circuit diagram, cycle chart,
// tables, the review) are a third of those pages' script, and some questions belong to one step
// only. They load as chunks of their own, so the page is ready to type in before their code has
// arrived (the bench's `bundle` section counts what a page loads before it is interactive).
// The server loads them all when it starts and renders them in place, so its HTML is whole (also
// for a browser without JavaScript); in the browser React keeps that HTML until the chunk is
// there, then hydrates it.

const parts: (() => Promise<unknown>)[] = [];

/** Loads every part now; a part rendered after this renders in place, at once. */
export const loadEveryPart = () => Promise.all(parts.map((load) => load()));

/** A component loaded on its first render, shown through `fallback` until it has arrived. */
function later<P extends object>(load: () => Promise<ComponentType<P>>, fallback: ReactNode) {
  let loaded: ComponentType<P> | undefined;
  let loading: Promise<ComponentType<P>> | undefined;
  const loadOnce = () => (loading ??= load().then((component) => (loaded = component)));
  parts.push(loadOnce);
  const Lazy = lazy(async () => ({ default: await loadOnce() }));
  return function Later(props: P) {
    // Chosen once per instance: switching from Lazy to the loaded component would remount it.
    const [Part] = useState<ComponentType<P>>(() => loaded ?? Lazy);
    return (
      <Suspense fallback={fallback}>
        <Part {...props} />
      </Suspense>
    );
  };
}

const drawing = (
  <Card>
    <p className="text-sm text-ink-600">Drawing the circuit…</p>
  </Card>
);

export const DesignReport = later(() => import("./design-report").then((m) => m.DesignReport), drawing);
export const MachineReport = later(() => import("./machine-report").then((m) => m.MachineReport), drawing);
export const SpecReview = later(() => import("./spec-review").then((m) => m.SpecReview), drawing);
export const SpecLivePreview = later(() => import("./spec-live-preview").then((m) => m.SpecLivePreview), drawing);
export const MachinePreview = later(() => import("./machine-preview").then((m) => m.MachinePreview), drawing);
export const MachineCyclePreview = later(() => import("./machine-preview").then((m) => m.MachineCyclePreview), null);
// Questions of one step each (the spec form's page serves every step).
export const AxesFields = later(() => import("./spec-step-fields").then((m) => m.AxesFields), null);
export const CycleFields = later(() => import("./spec-step-fields").then((m) => m.CycleFields), null);
export const QuotationFields = later(() => import("./spec-step-fields").then((m) => m.QuotationFields), null);
// Only the quotation step has the drawings' uploader (its own form, beside the step's).
export const AttachmentUploader = later(
  () => import("./attachment-uploader").then((m) => m.AttachmentUploader),
  <p className="text-sm text-ink-600">Loading the drawings…</p>,
);

if (import.meta.env.SSR) void loadEveryPart();
