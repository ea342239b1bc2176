import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { OpenPatternFileComponent } from './open-pattern-file.component';
import { PatternsService } from '../resources/patterns.service';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';

const good = {
  formatVersion: 1,
  title: 'From a file',
  canvas: { widthIn: 10, heightIn: 10 },
  sections: [{ id: 'a', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }] } }],
  referenceImage: { uploadId: 'someone-elses', origin: { x: 0, y: 0 }, widthIn: 10, opacity: 0.5 },
};
const broken = {
  ...good,
  sections: [
    { id: 'a', label: 'a', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 400 }] } },
  ],
};

describe('OpenPatternFileComponent', () => {
  async function setup() {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    const fixture = TestBed.createComponent(OpenPatternFileComponent);
    fixture.detectChanges();
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const http = TestBed.inject(HttpTestingController);
    const nav = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const create = vi.spyOn(TestBed.inject(PatternsService), 'create');
    const input = el.querySelector('input[type=file][aria-label="Pattern file"]') as HTMLInputElement;
    const choose = async (name: string, content: unknown) => {
      const file = new File([typeof content === 'string' ? content : JSON.stringify(content)], name, { type: 'application/json' });
      Object.defineProperty(input, 'files', { value: [file], configurable: true });
      input.dispatchEvent(new Event('change'));
      // Reading the file is asynchronous: wait until it ends in problems shown or a request sent.
      await vi.waitFor(() => {
        fixture.detectChanges();
        if (!el.querySelector('[role=alert]') && create.mock.calls.length === 0) throw new Error('still reading');
      });
      fixture.detectChanges();
    };
    return { el, http, nav, input, choose, fixture };
  }

  it('offers a named button that opens the file chooser', async () => {
    const { fixture, input } = await setup();
    const button = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: /Open a pattern file$/ }));
    const click = vi.spyOn(input, 'click').mockImplementation(() => undefined);
    await button.click();
    expect(click).toHaveBeenCalled();
    expect(input.accept).toContain('.json');
  });

  it('lists every problem of an invalid file with its path, in an alert, and sends nothing', async () => {
    const { el, http, nav, choose } = await setup();
    await choose('broken.seamwright.json', broken);
    const alert = el.querySelector('[role=alert]');
    expect(alert?.querySelector('h2')?.textContent).toContain('“broken.seamwright.json” was not opened: 2 problems. Nothing was saved.');
    expect(Array.from(alert?.querySelectorAll('li') ?? []).map((li) => li.textContent?.trim())).toEqual([
      'sections[0].label: must be one to three capital letters',
      'sections[0].geometry.vertices[2].y: must be within ±200 in.',
    ]);
    http.expectNone('/api/patterns');
    expect(nav).not.toHaveBeenCalled();
  });

  it('says when the file is not JSON at all', async () => {
    const { el, choose } = await setup();
    await choose('notes.json', 'hello');
    expect(el.querySelector('[role=alert] li')?.textContent).toMatch(/^\(file\): not a JSON file/);
  });

  it('creates a pattern of a valid file, without the traced image, and opens its board', async () => {
    const { http, nav, choose, fixture } = await setup();
    await choose('good.seamwright.json', good);
    const req = http.expectOne({ method: 'POST', url: '/api/patterns' });
    const sent = (req.request.body as { document: Record<string, unknown> }).document;
    expect(sent['title']).toBe('From a file');
    expect(sent['referenceImage']).toBeUndefined();
    expect(sent['seamAllowanceIn']).toBe(0.25);
    req.flush({ pattern: { id: 'p-new', title: 'From a file' }, revision: { number: 1, document: sent } });
    await fixture.whenStable();
    expect(nav).toHaveBeenCalledWith(['/patterns', 'p-new', 'board']);
  });

  it('lists the problems the server finds, with paths in the file', async () => {
    const { el, http, nav, choose, fixture } = await setup();
    await choose('good.seamwright.json', good);
    http.expectOne('/api/patterns').flush(
      { error: 'The pattern document is not valid', details: [{ path: 'document.sections.0.geometry', message: 'outline crosses itself' }] },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[role=alert] li')?.textContent?.trim()).toBe('sections[0].geometry: outline crosses itself');
    expect(nav).not.toHaveBeenCalled();
  });
});
