import { TestBed } from '@angular/core/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { ColourwaysComponent } from './colourways.component';
import { sampleBlock } from '../../../../../../tests/fixtures/sample-block';

/** A 12 in. square cut on the diagonal (Plum above, Oat below) with one colourway, "Colourway 1". */
function pattern(): PatternDocument {
  return readPatternDocument({
    ...sampleBlock('Diagonal', 12),
    colourways: [{ id: 'cw1', name: 'Colourway 1', fabrics: {} }],
  });
}

/**
 * The colourways for a designer, with the chosen one open. Edits are applied the way the Quilt page
 * applies them (to its own newest document), while the component's `document` input is left as it
 * was: without zone.js, events can come before change detection brings the input up to date.
 */
function render() {
  const fixture = TestBed.createComponent(ColourwaysComponent);
  let current = pattern();
  fixture.componentRef.setInput('document', current);
  fixture.componentRef.setInput('chosenId', 'cw1');
  fixture.componentRef.setInput('canEdit', true);
  const chosen: Array<string | null> = [];
  fixture.componentInstance.edit.subscribe((edit) => (current = edit(current)));
  fixture.componentInstance.choose.subscribe((id) => chosen.push(id));
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, el, chosen, doc: () => current };
}

describe('ColourwaysComponent', { timeout: 20_000 }, () => {
  it('keeps a new name when a colour is picked before the page has drawn again', () => {
    const { el, doc } = render();
    const name = el.querySelector<HTMLInputElement>('input[maxlength="80"]')!;
    expect(name.value).toBe('Colourway 1');
    name.value = 'Dusk';
    name.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    // No change detection here: the input still holds the document without the new name.
    const colours = [...el.querySelectorAll<HTMLInputElement>('input[type="color"]')];
    expect(colours).toHaveLength(2);
    colours[0]!.value = '#1d3557';
    colours[0]!.dispatchEvent(new Event('input'));
    const colourway = doc().colourways?.[0];
    expect(colourway?.name).toBe('Dusk');
    expect(colourway?.fabrics[doc().fabrics[0]!.id]?.colour).toBe('#1d3557');
  });

  it('adds a colourway after the chosen one and chooses it, twice in a row without a redraw', () => {
    const { el, doc, chosen } = render();
    const add = [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('Add a colourway'))!;
    add.click();
    add.click();
    // Each copy starts from the chosen colourway and gets its own id, even with the input not yet updated.
    expect(doc().colourways?.map((c) => c.name)).toEqual(['Colourway 1', 'Colourway 1 (copy)', 'Colourway 1 (copy)']);
    const ids = doc().colourways!.map((c) => c.id);
    expect(new Set(ids).size).toBe(3);
    expect(chosen).toEqual([ids[1], ids[2]]);
  });
});
