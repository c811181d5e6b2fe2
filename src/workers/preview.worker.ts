/// <reference lib="webworker" />
/**
 * The live preview's Web Worker: solves one shot off the main thread so the page never freezes.
 * The field and contours go back first; rays, when asked for, follow in a second message.
 * The page sends one request at a time and drops replies to stale ones (usePreview.ts).
 */
import { EikonalInputError } from '../../shared/eikonal';
import { PreviewEngine, traceRays } from './preview-core';
import type { FieldReply, PreviewReply, PreviewRequest, RaysReply } from './protocol';

const engine = new PreviewEngine();
const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<PreviewRequest>) => {
  const req = event.data;
  try {
    const field = engine.solveField(req);
    const times = req.rays ? field.times.slice() : field.times;
    const reply: FieldReply = { kind: 'field', id: req.id, ...field, times, final: !req.rays };
    scope.postMessage(reply, [times.buffer, field.receiverTimes.buffer, ...field.contours.map((c) => c.buffer)]);
    if (req.rays) {
      const t0 = performance.now();
      const rays = traceRays(req, field.times);
      const raysReply: RaysReply = { kind: 'rays', id: req.id, rays, rayMs: performance.now() - t0, final: true };
      scope.postMessage(raysReply, rays.map((r) => r.buffer));
    }
  } catch (err) {
    const message = err instanceof EikonalInputError ? err.message : `The preview failed: ${(err as Error)?.message ?? String(err)}`;
    scope.postMessage({ kind: 'error', id: req.id, message, final: true } satisfies PreviewReply);
  }
};
