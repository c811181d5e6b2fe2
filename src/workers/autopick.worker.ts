/// <reference lib="webworker" />
/**
 * The automatic first-break picker off the page's main thread: a record's traces in, one outcome per
 * trace out (shared/picking). Auto-picking every record of a line no longer freezes the page.
 */
import { pickGather, type GatherTrace } from '../../shared/picking';

export interface AutoPickRequest {
  id: number;
  traces: GatherTrace[];
  positions: (number | null)[] | null;
}

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<AutoPickRequest>) => {
  const { id, traces, positions } = event.data;
  try {
    scope.postMessage({ id, outcomes: pickGather(traces, positions) });
  } catch (err) {
    scope.postMessage({ id, error: (err as Error)?.message ?? String(err) });
  }
};
