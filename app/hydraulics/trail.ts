/** Recording how each number was reached. */

export interface TrailInput {
  value: number | string;
  unit: string;
}

export interface TrailEntry {
  quantity: string;
  value: number | string;
  unit: string;
  formula: string;
  /** name → { value, unit } for every input the formula used */
  inputs: Record<string, TrailInput>;
  source: string;
}

/** Collects trail entries in the order the engine works them out. */
export class Trail {
  readonly entries: TrailEntry[] = [];

  add(quantity: string, value: number | string, unit: string, formula: string, inputs: Record<string, TrailInput>, source: string): void {
    this.entries.push({ quantity, value, unit, formula, inputs, source });
  }
}

/** Shorthand for a trail input. */
export const v = (value: number | string, unit: string): TrailInput => ({ value, unit });
