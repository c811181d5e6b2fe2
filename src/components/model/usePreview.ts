/**
 * The live preview's link to its Web Worker. When the worker is idle a change is sent at once;
 * while it solves, changes are debounced and only the newest waiting request is kept, so a burst
 * of edits costs one extra solve, not one per edit. A solve that has run long while newer work waits (a big grid)
 * is cancelled for real by terminating the worker and starting a fresh one. Replies to stale
 * requests are dropped.
 */
import { useEffect, useRef, useState } from 'react';
import type { RasterModel } from '../../../shared/model';
import type { PlacedShot } from '../../../shared/picks';
import type { FieldReply, PreviewReply, PreviewRequest, RaysReply } from '../../workers/protocol';

export interface PreviewJob {
  raster: RasterModel;
  shot: PlacedShot;
  rays: boolean;
  /** performance.now() of the edit that produced this raster, for the redraw timing. */
  editedAt: number;
}

export interface PreviewState {
  status: 'idle' | 'solving' | 'done' | 'error';
  field: FieldReply | null;
  rays: RaysReply | null;
  message: string | null;
  /** editedAt of the job whose field is shown. */
  editedAt: number | null;
  /** performance.now() when that job went to the worker and when its field came back. */
  sentAt: number | null;
  receivedAt: number | null;
}

const DEBOUNCE_MS = 30;
/** A running solve older than this is abandoned (worker restarted) when newer work is waiting. */
const CANCEL_AFTER_MS = 400;

const IDLE: PreviewState = { status: 'idle', field: null, rays: null, message: null, editedAt: null, sentAt: null, receivedAt: null };

/** One worker, one request in flight, the newest request waiting. */
class PreviewLink {
  private worker: Worker | null = null;
  private nextId = 1;
  private latest = 0;
  private inFlight: { id: number; since: number } | null = null;
  private pending: PreviewRequest | null = null;
  private staleTimer = 0;
  private editedAt = new Map<number, number>();
  private sentAt = new Map<number, number>();

  constructor(private readonly update: (fn: (s: PreviewState) => PreviewState) => void) {}

  request(job: PreviewJob): void {
    const id = this.nextId++;
    this.latest = id;
    this.editedAt.set(id, job.editedAt);
    this.update((s) => ({ ...s, status: 'solving' }));
    this.send({
      id,
      grid: job.raster.grid,
      velocity: job.raster.velocity.slice(),
      active: job.raster.active.slice(),
      cellSlowness: job.raster.cellSlowness?.slice(),
      surface: job.raster.surface,
      source: job.shot.source,
      receivers: job.shot.receivers.slice(),
      order: 2,
      rays: job.rays,
    });
  }

  get busy(): boolean {
    return this.inFlight !== null;
  }

  clear(): void {
    this.latest = 0;
    this.pending = null;
    this.update(() => IDLE);
  }

  close(): void {
    window.clearTimeout(this.staleTimer);
    this.worker?.terminate();
    this.worker = null;
    this.inFlight = null;
    this.pending = null;
  }

  private send(request: PreviewRequest): void {
    if (this.inFlight) {
      this.pending = request;
      const waited = performance.now() - this.inFlight.since;
      window.clearTimeout(this.staleTimer);
      this.staleTimer = window.setTimeout(() => this.cancelStale(), Math.max(0, CANCEL_AFTER_MS - waited));
      return;
    }
    this.pending = null;
    this.inFlight = { id: request.id, since: performance.now() };
    this.sentAt.set(request.id, this.inFlight.since);
    const transfer = [request.velocity.buffer, request.active.buffer, request.receivers.buffer];
    if (request.cellSlowness) transfer.push(request.cellSlowness.buffer);
    this.ensureWorker().postMessage(request, transfer);
  }

  private cancelStale(): void {
    if (!this.inFlight || !this.pending || performance.now() - this.inFlight.since < CANCEL_AFTER_MS) return;
    this.worker?.terminate();
    this.worker = null;
    this.inFlight = null;
    this.send(this.pending);
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const w = new Worker(new URL('../../workers/preview.worker.ts', import.meta.url), { type: 'module' });
    w.onmessage = (e: MessageEvent<PreviewReply>) => {
      if (this.worker === w) this.receive(e.data);
    };
    w.onerror = (e) => {
      e.preventDefault();
      if (this.worker !== w) return;
      w.terminate();
      this.worker = null;
      this.inFlight = null;
      this.update((s) => ({ ...s, status: 'error', message: 'The preview worker stopped unexpectedly. Change the model or choose the shot again to retry.' }));
    };
    this.worker = w;
    return w;
  }

  private receive(reply: PreviewReply): void {
    if (reply.id === this.latest) {
      const times = { editedAt: this.editedAt.get(reply.id) ?? null, sentAt: this.sentAt.get(reply.id) ?? null, receivedAt: performance.now() };
      if (reply.kind === 'field') this.update(() => ({ status: reply.final ? 'done' : 'solving', field: reply, rays: null, message: null, ...times }));
      else if (reply.kind === 'rays') this.update((s) => ({ ...s, status: 'done', rays: reply }));
      else this.update(() => ({ status: 'error', field: null, rays: null, message: reply.message, ...times }));
    }
    if (reply.final) {
      this.editedAt.delete(reply.id);
      this.sentAt.delete(reply.id);
      this.inFlight = null;
      window.clearTimeout(this.staleTimer);
      const next = this.pending;
      if (next) this.send(next);
    }
  }
}

export function usePreview(job: PreviewJob | null): PreviewState {
  const [state, setState] = useState<PreviewState>(IDLE);
  const linkRef = useRef<PreviewLink | null>(null);

  useEffect(() => {
    const link = new PreviewLink(setState);
    linkRef.current = link;
    return () => {
      link.close();
      linkRef.current = null;
    };
  }, []);

  useEffect(() => {
    if (!job) {
      linkRef.current?.clear();
      return;
    }
    const link = linkRef.current;
    if (link && !link.busy) {
      link.request(job); // idle worker: no reason to wait
      return;
    }
    const timer = window.setTimeout(() => linkRef.current?.request(job), DEBOUNCE_MS);
    return () => window.clearTimeout(timer);
  }, [job]);

  return state;
}
