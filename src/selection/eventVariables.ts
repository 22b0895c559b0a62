/**
 * Per-event variable values, computed lazily: a variable is computed the
 * first time a cut asks for it in an event and cached until the next event,
 * so an event that fails an early step never pays for pair masses.
 */
import type { RecoEvent } from '../detector/recoEvent.js';
import type { VariableReader } from './expression/compile.js';
import { OBJECT_DEFAULTS } from './objectDefaults.js';
import { AnalysisObjects, type ObjectDefinitions } from './objects.js';
import { VARIABLES } from './variables.js';

const COMPUTE = VARIABLES.map((v) => v.compute);

export class EventVariables implements VariableReader {
  readonly objects: AnalysisObjects;
  private readonly values = new Float64Array(VARIABLES.length);
  private readonly stamp = new Uint32Array(VARIABLES.length);
  private epoch = 1;

  constructor(objects: AnalysisObjects) {
    this.objects = objects;
  }

  /** Forgets the cached values: call after `objects.build(event)`. */
  nextEvent(): void {
    this.epoch = (this.epoch + 1) >>> 0;
    if (this.epoch === 0) {
      this.stamp.fill(0);
      this.epoch = 1;
    }
  }

  /** Value of the variable in `slot` (index in `VARIABLES`) for the current event. */
  value(slot: number): number {
    if (this.stamp[slot] !== this.epoch) {
      COMPUTE[slot]!(this.objects, this.values, slot);
      this.stamp[slot] = this.epoch;
    }
    return this.values[slot]!;
  }
}

/**
 * Every variable of one reconstructed event, by name: the friendly facade
 * for scripts, tests and debugging (the engine uses `EventVariables`).
 *
 * @example
 * variablesOfEvent(event).n_leptons // 3
 */
export function variablesOfEvent(event: RecoEvent, definitions: ObjectDefinitions = OBJECT_DEFAULTS): Record<string, number> {
  const objects = new AnalysisObjects(definitions);
  objects.build(event);
  const reader = new EventVariables(objects);
  const out: Record<string, number> = {};
  VARIABLES.forEach((v, slot) => {
    out[v.name] = reader.value(slot);
  });
  return out;
}
