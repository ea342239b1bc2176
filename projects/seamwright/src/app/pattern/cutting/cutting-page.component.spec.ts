import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { scalePattern } from '@seamwright/piecing/testing';
import { PatternContext } from '../pattern-context.service';
import { CuttingPageComponent } from './cutting-page.component';
import { stripSetSquare } from '../../../../../../tests/fixtures/strip-set-square';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTableHarness } from '@angular/material/table/testing';

/** A 4 in. square split in two: A1 Plum, A2 a two-strip set with the internal id "t-lz9q". */
function pattern(name?: string): PatternDocument {
  return readPatternDocument(stripSetSquare({ title: 'Strips', sizeIn: 4, stripWidthIn: 2, stripSetId: 't-lz9q', stripSetName: name }));
}

function render(doc: PatternDocument) {
  const document = signal<PatternDocument | null>(doc);
  TestBed.configureTestingModule({ providers: [{ provide: PatternContext, useValue: { document } }] });
  const fixture = TestBed.createComponent(CuttingPageComponent);
  fixture.detectChanges();
  /** The strip-set strips of one fabric, cell texts by column. */
  const stripsOf = async (fabric: string) =>
    (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatTableHarness.with({ selector: `[aria-label="Strip-set strips of ${fabric}"]` }))).getCellTextByColumnName();
  return { el: fixture.nativeElement as HTMLElement, document, stripsOf };
}

describe('CuttingPageComponent', () => {
  // jsdom lays out no SVG text: svg.js asks for a text's box to place it; give it an empty one.
  beforeAll(() => {
    const proto = SVGElement.prototype as unknown as { getBBox?: () => DOMRect };
    proto.getBBox ??= () => ({ x: 0, y: 0, width: 0, height: 0 }) as DOMRect;
  });

  it('calls an unnamed strip set by the patch it fills, never by its id', async () => {
    const { el, stripsOf } = render(pattern());
    expect(el.textContent).not.toContain('t-lz9q');
    expect(el.querySelector('section.stripset h3')?.textContent?.trim()).toBe('Strip set for A2');
    expect(el.querySelector('section.stripset')?.getAttribute('aria-label')).toBe('Strip set for A2');
    expect((await stripsOf('Oat'))['set'].text).toEqual(['Strip set for A2, strip 1']);
    expect(el.querySelector('sw-strip-diagram [role="img"]')?.getAttribute('aria-label')).toMatch(/^Strip set for A2: Oat cut/);
  });

  it('shows the name a designer gave', () => {
    const { el } = render(pattern('Dawn stripes'));
    expect(el.querySelector('section.stripset h3')?.textContent?.trim()).toBe('Dawn stripes');
    expect(el.textContent).toContain('Dawn stripes, strip 2');
  });

  it('follows a resized design: strips cut at the new finished width plus the same allowance, to the sixteenth', async () => {
    const { document, stripsOf } = render(pattern());
    document.set(scalePattern(pattern(), 1.28125));
    // 2 in. strips at 1.28125× finish at 2 9/16 in. and are cut 2 9/16 + 2 × ¼ = 3 1/16 in. wide: shown to the
    // sixteenth, not rounded to an eighth a quilter would cut wrong.
    const strips = await stripsOf('Oat');
    expect([strips['finished'].headerText, strips['finished'].text]).toEqual([['Finished width'], ['2 ⁹⁄₁₆ in.']]);
    expect([strips['cut'].headerText, strips['cut'].text]).toEqual([['Cut width'], ['3 ¹⁄₁₆ in.']]);
  });
});
