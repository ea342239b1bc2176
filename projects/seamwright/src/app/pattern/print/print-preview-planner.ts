import { DestroyRef, Injectable, inject } from '@angular/core';
import { Observable, defer, from, map } from 'rxjs';
import type { PreviewRequest, PreviewResult } from './print-preview-plan';

/**
 * Plans print previews in a Web Worker (print-preview.worker.ts), so planning never blocks the page.
 * Each request gets the next id; an answer is delivered only to the request with its id, and a
 * request dropped before its answer (unsubscribed, e.g. by switchMap when the form changed again) is
 * never answered. Where workers are unavailable (jsdom in unit tests) the plan runs on the page.
 * Provided per print page; the worker ends with it.
 */
@Injectable()
export class PrintPreviewPlanner {
  private worker: Worker | null | undefined;
  private lastId = 0;

  constructor() {
    inject(DestroyRef).onDestroy(() => this.worker?.terminate());
  }

  /** Plans one preview; emits its result once and completes. */
  plan(request: Omit<PreviewRequest, 'id'>): Observable<PreviewResult> {
    return defer(() => {
      const ask: PreviewRequest = { ...request, id: ++this.lastId };
      const worker = this.ensureWorker();
      return worker ? this.inWorker(worker, ask) : this.onPage(ask);
    });
  }

  private inWorker(worker: Worker, ask: PreviewRequest): Observable<PreviewResult> {
    return new Observable<PreviewResult>((subscriber) => {
      const onMessage = (event: MessageEvent<PreviewResult>) => {
        if (event.data.id !== ask.id) return;
        subscriber.next(event.data);
        subscriber.complete();
      };
      const onError = (event: ErrorEvent) => {
        subscriber.next({ id: ask.id, error: event.message || 'The preview could not be planned' });
        subscriber.complete();
      };
      worker.addEventListener('message', onMessage);
      worker.addEventListener('error', onError);
      worker.postMessage(ask);
      return () => {
        worker.removeEventListener('message', onMessage);
        worker.removeEventListener('error', onError);
      };
    });
  }

  /** The main-thread fallback; the planning code is loaded only when it is needed. */
  private onPage(ask: PreviewRequest): Observable<PreviewResult> {
    return from(import('./print-preview-plan')).pipe(map((m) => m.planPreview(ask)));
  }

  private ensureWorker(): Worker | null {
    if (this.worker === undefined) {
      this.worker = typeof Worker === 'undefined' ? null : new Worker(new URL('./print-preview.worker', import.meta.url), { type: 'module' });
    }
    return this.worker;
  }
}
