import { findSewableOrder, type Section } from '@seamwright/piecing';
import type { BoardOrderSearch } from './board-patch';

/** A question to the order-search worker: one section, with the id its answer carries back. */
export interface OrderSearchRequest {
  id: number;
  section: Section;
}

/** The worker's answer to the request with the same id. */
export interface OrderSearchAnswer {
  id: number;
  result: BoardOrderSearch;
}

/**
 * The order search of one section as the board reports it (docs/design-notes.md#sewability): a
 * sewable order, or why there is none (with a suggested split), or that the search could not decide
 * within its work budget. Runs wherever it is called: in the worker, or on the page as the fallback.
 */
export function boardOrderSearch(section: Section): BoardOrderSearch {
  const r = findSewableOrder(section);
  if (r.found) return { ok: true, order: r.order };
  const undecided = r.status === 'undecided' ? { undecided: true as const } : {};
  return r.suggestion ? { ok: false, reason: r.message, suggestedSplit: { a: r.suggestion.from, b: r.suggestion.to }, ...undecided } : { ok: false, reason: r.message, ...undecided };
}

/** What the runner needs of a Web Worker (tests hand in a stand-in). */
export interface OrderSearchWorker {
  postMessage(request: OrderSearchRequest): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<OrderSearchAnswer>) => void): void;
  addEventListener(type: 'error', listener: (event: ErrorEvent) => void): void;
  terminate(): void;
}

/** The board's worker (order-search.worker.ts), or null where there are no workers (unit tests, Node). */
export function startOrderSearchWorker(): OrderSearchWorker | null {
  return typeof Worker === 'undefined' ? null : (new Worker(new URL('./order-search.worker', import.meta.url), { type: 'module' }) as OrderSearchWorker);
}

/**
 * Runs order searches off the page's main thread, in a Web Worker, so a long search never blocks the
 * board. Only the newest search is answered: starting another (or {@link cancel}) drops the answer of
 * the one before, by request id. Where there is no worker, or it fails, the search runs on the page
 * and answers at once.
 */
export class OrderSearchRunner {
  private worker: OrderSearchWorker | null | undefined;
  private latest = 0;
  private waiting: { id: number; section: Section; done: (result: BoardOrderSearch) => void } | null = null;

  constructor(private readonly startWorker: () => OrderSearchWorker | null = startOrderSearchWorker) {}

  /** Whether a search is waiting for the worker's answer. */
  get busy(): boolean {
    return this.waiting !== null;
  }

  /** Searches a sewable order of `section`; `done` gets the answer unless another search starts first. */
  search(section: Section, done: (result: BoardOrderSearch) => void): void {
    const id = ++this.latest;
    const worker = this.ensureWorker();
    if (!worker) {
      this.waiting = null;
      done(boardOrderSearch(section));
      return;
    }
    this.waiting = { id, section, done };
    worker.postMessage({ id, section });
  }

  /** Drops the answer of the search in progress, if any. */
  cancel(): void {
    this.latest++;
    this.waiting = null;
  }

  /** Ends the worker. */
  dispose(): void {
    this.cancel();
    this.worker?.terminate();
    this.worker = null;
  }

  private ensureWorker(): OrderSearchWorker | null {
    if (this.worker === undefined) {
      this.worker = this.startWorker();
      this.worker?.addEventListener('message', (event: MessageEvent<OrderSearchAnswer>) => this.answer(event.data.id, event.data.result));
      this.worker?.addEventListener('error', () => {
        // A worker that cannot run (a failed load): searches from now on run on the page.
        const pending = this.waiting;
        this.worker?.terminate();
        this.worker = null;
        if (pending) this.answer(pending.id, boardOrderSearch(pending.section));
      });
    }
    return this.worker;
  }

  private answer(id: number, result: BoardOrderSearch): void {
    const pending = this.waiting;
    if (!pending || pending.id !== id || id !== this.latest) return;
    this.waiting = null;
    pending.done(result);
  }
}
