import { TestBed } from '@angular/core/testing';
import { Subject, switchMap } from 'rxjs';
import { buildGardenGate } from '@seamwright/piecing';
import { PrintPreviewPlanner } from './print-preview-planner';
import { planPreview, type PreviewRequest, type PreviewResult } from './print-preview-plan';

/** A stand-in for the browser's Worker (jsdom has none): records what is posted, answers on demand. */
class FakeWorker extends EventTarget {
  static last: FakeWorker | null = null;
  readonly posted: PreviewRequest[] = [];
  terminated = false;
  constructor(readonly url: URL | string) {
    super();
    FakeWorker.last = this;
  }
  postMessage(data: PreviewRequest): void {
    this.posted.push(data);
  }
  answer(result: PreviewResult): void {
    this.dispatchEvent(new MessageEvent('message', { data: result }));
  }
  terminate(): void {
    this.terminated = true;
  }
}

const request = (marginIn: number): Omit<PreviewRequest, 'id'> => ({
  document: buildGardenGate(),
  options: { paper: 'letter', marginIn },
  pressingsPerTemplate: 16,
  sheetsShown: 12,
});

describe('PrintPreviewPlanner', () => {
  afterEach(() => {
    delete (globalThis as { Worker?: unknown }).Worker;
    FakeWorker.last = null;
  });

  it('plans on the page where there is no Worker: the same layout the worker would send', async () => {
    TestBed.configureTestingModule({ providers: [PrintPreviewPlanner] });
    const planner = TestBed.inject(PrintPreviewPlanner);
    const result = await new Promise<PreviewResult>((resolve) => planner.plan(request(0.5)).subscribe(resolve));
    const expected = planPreview({ ...request(0.5), id: result.id });
    expect('layout' in result && result.layout.templateSheetCount).toBe('layout' in expected && expected.layout.templateSheetCount);
    expect(result).toEqual(expected);
  });

  it('posts plain data to the worker, answers each request by its id, and never answers a dropped request', () => {
    (globalThis as { Worker?: unknown }).Worker = FakeWorker;
    TestBed.configureTestingModule({ providers: [PrintPreviewPlanner] });
    const planner = TestBed.inject(PrintPreviewPlanner);
    const asks = new Subject<number>();
    const got: PreviewResult[] = [];
    asks.pipe(switchMap((m) => planner.plan(request(m)))).subscribe((r) => got.push(r));

    asks.next(0.5);
    asks.next(0.75); // drops the first request before its answer came
    const worker = FakeWorker.last!;
    expect(worker.posted.map((p) => [p.id, p.options.marginIn])).toEqual([[1, 0.5], [2, 0.75]]);
    // What crosses to a worker is structured-cloned: the request must survive it unchanged.
    expect(structuredClone(worker.posted[1])).toEqual(worker.posted[1]);

    worker.answer({ id: 1, error: 'stale' });
    expect(got).toEqual([]);
    worker.answer({ id: 2, error: 'the answer to the second request' });
    expect(got).toEqual([{ id: 2, error: 'the answer to the second request' }]);
    worker.answer({ id: 2, error: 'again' });
    expect(got.length).toBe(1);

    TestBed.resetTestingModule();
    expect(worker.terminated).toBe(true);
  });

  it('a planned result survives structured cloning (what the worker posts back)', () => {
    const result = planPreview({ ...request(0.5), id: 7 });
    expect('layout' in result).toBe(true);
    expect(structuredClone(result)).toEqual(result);
  });
});
