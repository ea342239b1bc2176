import type { Point, Section } from '@seamwright/piecing';
import { describe, expect, it } from 'vitest';
import { OrderSearchRunner, boardOrderSearch, type OrderSearchAnswer, type OrderSearchRequest, type OrderSearchWorker } from './order-search-runner';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];

/** Three strips side by side (x = 2 and x = 4), numbered so that the middle one comes last: not sewable as numbered, sewable 1-3-2 reversed. */
const strips: Section = {
  id: 's',
  label: 'A',
  geometry: { kind: 'straight', vertices: rect(0, 0, 6, 3) },
  seams: [{ id: 'a', a: { x: 2, y: 0 }, b: { x: 2, y: 3 } }, { id: 'b', a: { x: 4, y: 0 }, b: { x: 4, y: 3 } }],
  patches: [{ number: 1, anchor: { x: 1, y: 1 } }, { number: 3, anchor: { x: 3, y: 1 } }, { number: 2, anchor: { x: 5, y: 1 } }],
};

/** A stand-in worker: keeps the requests and answers them when the test says, through the real search. */
class FakeWorker implements OrderSearchWorker {
  readonly requests: OrderSearchRequest[] = [];
  private onMessage: ((event: MessageEvent<OrderSearchAnswer>) => void) | null = null;
  private onError: ((event: ErrorEvent) => void) | null = null;
  terminated = false;
  postMessage(request: OrderSearchRequest): void {
    this.requests.push(structuredClone(request));
  }
  addEventListener(type: 'message' | 'error', listener: never): void {
    if (type === 'message') this.onMessage = listener;
    else this.onError = listener;
  }
  terminate(): void {
    this.terminated = true;
  }
  answer(request: OrderSearchRequest): void {
    this.onMessage?.({ data: { id: request.id, result: boardOrderSearch(request.section) } } as MessageEvent<OrderSearchAnswer>);
  }
  fail(): void {
    this.onError?.({ message: 'could not load' } as ErrorEvent);
  }
}

describe('OrderSearchRunner', () => {
  it('answers in the worker, later: the page goes on meanwhile', () => {
    const worker = new FakeWorker();
    const runner = new OrderSearchRunner(() => worker);
    const answers: unknown[] = [];
    runner.search(strips, (r) => answers.push(r));
    expect(answers).toEqual([]);
    expect(runner.busy).toBe(true);
    expect(worker.requests).toHaveLength(1);
    worker.answer(worker.requests[0]);
    // Sewable with a strip at an end last: 2 (right) or 1 (left) — here the search's own order, checked against the direct call.
    expect(answers).toEqual([boardOrderSearch(strips)]);
    expect(answers[0]).toMatchObject({ ok: true });
    expect(runner.busy).toBe(false);
  });

  it('drops the answer of a search that a newer one replaced, and of a cancelled one', () => {
    const worker = new FakeWorker();
    const runner = new OrderSearchRunner(() => worker);
    const answers: string[] = [];
    runner.search(strips, () => answers.push('first'));
    runner.search(strips, () => answers.push('second'));
    worker.answer(worker.requests[0]);
    expect(answers).toEqual([]);
    worker.answer(worker.requests[1]);
    expect(answers).toEqual(['second']);
    runner.search(strips, () => answers.push('third'));
    runner.cancel();
    worker.answer(worker.requests[2]);
    expect(answers).toEqual(['second']);
  });

  it('runs on the page, at once, where there is no worker or the worker fails', () => {
    const onPage = new OrderSearchRunner(() => null);
    const answers: unknown[] = [];
    onPage.search(strips, (r) => answers.push(r));
    expect(answers).toEqual([boardOrderSearch(strips)]);

    const worker = new FakeWorker();
    const failing = new OrderSearchRunner(() => worker);
    const late: unknown[] = [];
    failing.search(strips, (r) => late.push(r));
    worker.fail();
    expect(worker.terminated).toBe(true);
    expect(late).toEqual([boardOrderSearch(strips)]);
  });
});

describe('boardOrderSearch', () => {
  it('says when no order exists, with the suggested split', () => {
    // Offset seams: two columns whose crossing seams do not line up (docs/design-notes.md#sewability).
    const offset: Section = {
      id: 'o',
      label: 'C',
      geometry: { kind: 'straight', vertices: rect(0, 0, 4, 2) },
      seams: [{ id: 'v', a: { x: 2, y: 0 }, b: { x: 2, y: 2 } }, { id: 'l', a: { x: 0, y: 1 }, b: { x: 2, y: 1 } }, { id: 'r', a: { x: 2, y: 1.5 }, b: { x: 4, y: 1.5 } }],
      patches: [],
    };
    const r = boardOrderSearch(offset);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.undecided).toBeUndefined();
    expect(r.reason).toMatch(/^section C cannot be sewn in any order; cut it along the seam/);
    expect([r.suggestedSplit!.a.x, r.suggestedSplit!.b.x]).toEqual([2, 2]);
  });
});
