import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { ColourwayCopy } from '@seamwright/api';
import { buildOrchardWheel } from '@seamwright/piecing';
import { ColourwayCopyEditorComponent } from './colourway-copy-editor.component';
import { QuiltChoice } from './quilt-choice.service';

const URL = '/api/patterns/p1/colourway-copies/c1';

/** The quilter's copy of the Orchard Wheel's Dusk (projects/piecing/src/lib/demo/orchard-wheel-quilt.ts). */
function dusk(version = 1, plum = 'Midnight'): ColourwayCopy {
  return {
    id: 'c1',
    patternId: 'p1',
    sourceColourwayId: 'dusk',
    name: 'My Dusk',
    fabrics: {
      plum: { name: plum, colour: '#2b2d4f' },
      oat: { name: 'Fog', colour: '#cfd3d6' },
      sage: { name: 'Slate', colour: '#6f8291' },
      marigold: { name: 'Ember', colour: '#c8553d' },
      ink: { name: 'Coal', colour: '#1c1c22' },
    },
    version,
    createdAt: '2026-12-05T10:00:00.000Z',
    updatedAt: '2026-12-05T10:00:00.000Z',
  };
}

function render() {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), QuiltChoice] });
  const choice = TestBed.inject(QuiltChoice);
  choice.copies.set([dusk()]);
  choice.chooseCopy('c1');
  const fixture = TestBed.createComponent(ColourwayCopyEditorComponent);
  fixture.componentRef.setInput('patternId', 'p1');
  fixture.componentRef.setInput('copy', dusk());
  fixture.componentRef.setInput('document', buildOrchardWheel());
  let closed = 0;
  fixture.componentInstance.closed.subscribe(() => closed++);
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  /** The text field whose visible label is `label` (the label Material ties to the input). */
  const field = (label: string): HTMLInputElement => {
    const f = [...el.querySelectorAll('mat-form-field')].find((x) => x.querySelector('mat-label')?.textContent?.trim() === label);
    if (!f) throw new Error(`no field labelled ${label}`);
    return f.querySelector('input')!;
  };
  const type = (input: HTMLInputElement, value: string) => {
    input.value = value;
    input.dispatchEvent(new Event('input'));
    fixture.detectChanges();
  };
  const button = (name: string) => [...el.querySelectorAll('button')].find((b) => b.textContent?.includes(name))!;
  const http = TestBed.inject(HttpTestingController);
  // Follows the editor's input the way the choice bar does: the copy in the choice.
  const follow = () => {
    fixture.componentRef.setInput('copy', choice.copy()!);
    fixture.detectChanges();
  };
  return { fixture, el, field, type, button, http, choice, follow, closed: () => closed };
}

describe('ColourwayCopyEditorComponent', { timeout: 20_000 }, () => {
  it('labels every slot control after the pattern fabric it stands for', () => {
    const { el, field } = render();
    expect(field('Name of my copy').value).toBe('My Dusk');
    expect(field('My fabric for Plum').value).toBe('Midnight');
    expect(field('My fabric for Ink').value).toBe('Coal');
    expect(field('Note for Oat').value).toBe('');
    const colours = [...el.querySelectorAll<HTMLInputElement>('input[type=color]')];
    expect(colours.map((c) => [c.closest('label')?.textContent?.trim(), c.value])).toEqual([
      ['Colour of my fabric for Plum', '#2b2d4f'],
      ['Colour of my fabric for Oat', '#cfd3d6'],
      ['Colour of my fabric for Sage', '#6f8291'],
      ['Colour of my fabric for Marigold', '#c8553d'],
      ['Colour of my fabric for Ink', '#1c1c22'],
    ]);
    expect([...el.querySelectorAll('[role=group]')].map((g) => g.getAttribute('aria-label'))).toEqual([
      'Fabric slot Plum',
      'Fabric slot Oat',
      'Fabric slot Sage',
      'Fabric slot Marigold',
      'Fabric slot Ink',
    ]);
  });

  it('saves the name and every slot on top of the version, and keeps the saved copy', () => {
    const { el, field, type, button, http, choice, fixture } = render();
    type(field('My fabric for Plum'), 'Aubergine linen');
    type(field('Note for Plum'), '  from the corner shop ');
    const colour = el.querySelector<HTMLInputElement>('input[type=color]')!;
    colour.value = '#40203a';
    colour.dispatchEvent(new Event('input'));
    button('Save my copy').click();
    const req = http.expectOne(URL);
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({
      version: 1,
      name: 'My Dusk',
      fabrics: { ...dusk().fabrics, plum: { name: 'Aubergine linen', colour: '#40203a', note: 'from the corner shop' } },
    });
    req.flush({ copy: { ...dusk(2, 'Aubergine linen'), fabrics: req.request.body.fabrics } });
    fixture.detectChanges();
    expect(choice.copy()?.version).toBe(2);
    expect(choice.copy()?.fabrics['plum']).toEqual({ name: 'Aubergine linen', colour: '#40203a', note: 'from the corner shop' });
    expect(el.querySelector('[role=status]')?.textContent?.trim()).toBe('Saved “My Dusk”.');
    http.verify();
  });

  it('saves with Enter in a text field', () => {
    const { field, type, http } = render();
    type(field('Name of my copy'), 'Night orchard');
    field('Name of my copy').dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, cancelable: true }));
    const req = http.expectOne(URL);
    expect(req.request.body.name).toBe('Night orchard');
  });

  it('on a stale save (409) shows the latest copy and says so', () => {
    const { el, field, type, button, http, choice, follow } = render();
    type(field('My fabric for Plum'), 'Mine');
    button('Save my copy').click();
    http.expectOne(URL).flush({ error: 'This copy was changed elsewhere', details: { latest: dusk(3, 'Changed in another tab') } }, { status: 409, statusText: 'Conflict' });
    follow();
    expect(choice.copy()?.version).toBe(3);
    expect(field('My fabric for Plum').value).toBe('Changed in another tab');
    expect(el.querySelector('[role=alert]')?.textContent).toContain('changed in another window or tab');
  });

  it('deletes the copy, takes it out of the choice and closes', () => {
    const { button, http, choice, closed } = render();
    button('Delete my copy').click();
    const req = http.expectOne(URL);
    expect(req.request.method).toBe('DELETE');
    req.flush(null, { status: 204, statusText: 'No Content' });
    expect(choice.copies()).toEqual([]);
    expect(choice.colourwayCopyId()).toBeNull();
    expect(closed()).toBe(1);
  });
});
