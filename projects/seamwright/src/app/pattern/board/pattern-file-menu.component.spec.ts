import { TestBed } from '@angular/core/testing';
import { signal } from '@angular/core';
import { readPatternDocument } from '@seamwright/piecing';
import { PatternFileMenuComponent } from './pattern-file-menu.component';
import { PatternContext } from '../pattern-context.service';
import { parallel } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatMenuHarness } from '@angular/material/menu/testing';

const doc = readPatternDocument({
  formatVersion: 1,
  title: 'Menu / test: block',
  canvas: { widthIn: 10, heightIn: 8 },
  sections: [
    {
      id: 'a',
      label: 'A',
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] },
      seams: [{ id: 's', a: { x: 2, y: 0 }, b: { x: 2, y: 4 } }],
    },
  ],
});

/** A blob's text (the test DOM has no `Blob.text`). */
const textOf = (blob: Blob) =>
  new Promise<string>((resolve) => {
    const reader = new FileReader();
    reader.onload = () => resolve(reader.result as string);
    reader.readAsText(blob);
  });

describe('PatternFileMenuComponent', () => {
  const downloads: Array<{ name: string; blob: Blob }> = [];
  const created: Blob[] = [];
  const originalCreate = URL.createObjectURL;
  const originalRevoke = URL.revokeObjectURL;

  beforeEach(() => {
    downloads.length = 0;
    created.length = 0;
    URL.createObjectURL = (blob: Blob) => {
      created.push(blob);
      return `blob:test/${created.length}`;
    };
    URL.revokeObjectURL = () => undefined;
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      downloads.push({ name: this.download, blob: created[Number(this.href.split('/').pop()) - 1] });
    });
  });
  afterEach(() => {
    URL.createObjectURL = originalCreate;
    URL.revokeObjectURL = originalRevoke;
    vi.restoreAllMocks();
  });

  async function setup(canEdit: boolean) {
    TestBed.configureTestingModule({ providers: [{ provide: PatternContext, useValue: { canEdit: signal(canEdit) } }] });
    const fixture = TestBed.createComponent(PatternFileMenuComponent);
    fixture.componentRef.setInput('document', doc);
    fixture.detectChanges();
    const menu = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatMenuHarness);
    await menu.open();
    /** The entries' words, without their icons' ligatures. */
    const items = async () => {
      const found = await menu.getItems();
      return parallel(() => found.map(async (item) => (await item.host()).text({ exclude: 'mat-icon' })));
    };
    const choose = (text: string) => menu.clickItem({ text: new RegExp(text) });
    return { menu, items, choose };
  }

  it('offers the pattern file and both pictures to those who may change the design', async () => {
    const { menu, items } = await setup(true);
    expect(await menu.getTriggerText()).toContain('Download');
    expect(await items()).toEqual([
      'Pattern file (.seamwright.json)',
      'Front view as SVG',
      'Front view as PNG',
    ]);
  });

  it('offers quilters the pictures only', async () => {
    const { items } = await setup(false);
    expect(await items()).toEqual(['Front view as SVG', 'Front view as PNG']);
  });

  it('downloads the document on the board as a pattern file named after its title', async () => {
    const { choose } = await setup(true);
    await choose('Pattern file');
    expect(downloads).toHaveLength(1);
    expect(downloads[0].name).toBe('Menu test block.seamwright.json');
    expect(downloads[0].blob.type).toBe('application/json');
    expect(readPatternDocument(JSON.parse(await textOf(downloads[0].blob)))).toEqual(doc);
  });

  it('exports the front view as a true-size SVG with one path per patch', async () => {
    const { choose } = await setup(false);
    await choose('Front view as SVG');
    expect(downloads[0].name).toBe('Menu test block.svg');
    expect(downloads[0].blob.type).toBe('image/svg+xml');
    const svg = new DOMParser().parseFromString(await textOf(downloads[0].blob), 'image/svg+xml').documentElement;
    expect([svg.getAttribute('width'), svg.getAttribute('height')]).toEqual(['10in', '8in']);
    expect(Array.from(svg.querySelectorAll('path')).map((p) => p.getAttribute('data-patch'))).toEqual(['A1', 'A2']);
  });
});
