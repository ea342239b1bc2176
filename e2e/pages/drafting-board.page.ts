import { expect, type Locator, type Page } from '@playwright/test';
import { parseLength } from '../../projects/piecing/src/public-api';

/** A point in the pattern's inches. */
export interface InchPoint {
  x: number;
  y: number;
}

/** The board's view as the status line shows it. */
export interface BoardView {
  /** Screen pixels per inch. */
  scale: number;
  /** The document point at the board's top-left corner, in inches. */
  left: number;
  top: number;
  mirrored: boolean;
}

/**
 * The Drafting board of `<sw-pattern-editor>` as a user meets it, and nothing else: the board by its
 * role and name, tools by their keys, pointer positions worked out from the board's box on screen and
 * the view the status line shows (zoom in pixels per inch, the point at the top-left corner), the
 * Sections outline for what is drawn (sections, their patches and fabrics), the side panel's fields,
 * the live region, the piecing-order list and the sewability verdict.
 */
export class DraftingBoardPage {
  constructor(private readonly page: Page) {}

  /** The board itself (role application). */
  board(): Locator {
    return this.page.getByRole('application', { name: 'Drafting board' });
  }

  /** The Sections outline (an ARIA tree). */
  outline(): Locator {
    return this.page.getByRole('tree', { name: 'Sections' });
  }

  /** The editor's live region (what is selected, what each key did). */
  liveRegion(): Locator {
    return this.page.locator('sw-board-announcer').getByRole('status');
  }

  /** The status line's view readout. */
  viewReadout(): Locator {
    return this.page.getByLabel('View', { exact: true });
  }

  /** Waits until the board is drawn (its canvas shown) and the status line shows the view. */
  async ready(): Promise<void> {
    // The board's code loads with the page: on a busy machine that takes a while.
    await expect(this.board()).toBeVisible({ timeout: 30_000 });
    await expect(this.board().locator('canvas').first()).toBeVisible();
    await expect(this.viewReadout()).toHaveText(/px per in\./);
    await expect(this.page.getByRole('heading', { name: 'Sections', exact: true })).toBeVisible();
  }

  /** The view as the status line shows it. */
  async viewport(): Promise<BoardView> {
    const text = (await this.viewReadout().textContent()) ?? '';
    const m = /\(([\d.]+) px per in\.\), top left x (-?[\d.]+) in\., y (-?[\d.]+) in\.(, mirrored)?/.exec(text);
    if (!m) throw new Error(`the status line shows no view: "${text}"`);
    return { scale: Number(m[1]), left: Number(m[2]), top: Number(m[3]), mirrored: m[4] !== undefined };
  }

  /** Screen position of a point in inches: the board's box on screen and the view the status line shows. */
  async screen(p: InchPoint): Promise<InchPoint> {
    const box = await this.board().boundingBox();
    if (!box) throw new Error('the board is not on screen');
    const v = await this.viewport();
    const dx = v.mirrored ? v.left - p.x : p.x - v.left;
    return { x: box.x + dx * v.scale, y: box.y + (p.y - v.top) * v.scale };
  }

  /** Picks a tool with its key (the board gets focus first). */
  async tool(key: string): Promise<void> {
    await this.board().focus();
    await this.page.keyboard.press(key);
    await expect(this.board()).toBeFocused();
  }

  /** What the active tool asks for next (the status line's hint). */
  hint(): Locator {
    return this.page.locator('sw-board-status .hint');
  }

  /** Presses, drags through the middle and releases. */
  async drag(from: InchPoint, to: InchPoint, steps = 6): Promise<void> {
    const a = await this.screen(from);
    const b = await this.screen(to);
    await this.page.mouse.move(a.x, a.y);
    await this.page.mouse.down();
    await this.page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps });
    await this.page.mouse.move(b.x, b.y, { steps });
    await this.page.mouse.up();
  }

  /** Moves to a point and clicks there. */
  async click(p: InchPoint): Promise<void> {
    const s = await this.screen(p);
    await this.page.mouse.move(s.x, s.y, { steps: 3 });
    await this.page.mouse.down();
    await this.page.mouse.up();
  }

  /** The outline's section items ("B, arc section, 4 patches"). */
  sectionItems(): Locator {
    return this.outline().locator('[role="treeitem"][aria-level="1"]');
  }

  /** The outline's patch items ("A2" or "A2, Plum"), of every open section. */
  patchItems(): Locator {
    return this.outline().locator('[role="treeitem"][aria-level="2"]');
  }

  /** The number of sections and of patches, as the Sections outline lists them. */
  async counts(): Promise<{ sections: number; patches: number }> {
    if ((await this.outline().count()) === 0) return { sections: 0, patches: 0 };
    const names = await this.sectionItems().evaluateAll((items) => items.map((li) => li.getAttribute('aria-label') ?? ''));
    const patches = names.reduce((n, name) => n + Number(/(\d+) patch(es)?$/.exec(name)?.[1] ?? 0), 0);
    return { sections: names.length, patches };
  }

  /** The patch labels the Sections outline lists, sorted. */
  async boardLabels(): Promise<string[]> {
    if ((await this.outline().count()) === 0) return [];
    const texts = await this.patchItems().allTextContents();
    return texts.map((t) => t.trim().split(',')[0]).sort();
  }

  /** The fabric names of the first section's patches as the outline names them ('' for none), sorted. */
  async patchFabrics(): Promise<string[]> {
    const first = this.sectionItems().first().locator('[role="treeitem"]');
    const texts = await first.allTextContents();
    return texts.map((t) => t.trim().split(', ')[1] ?? '').sort();
  }

  /** The drawing area, from the side panel's Drawing width and height (shown with nothing selected). */
  async canvas(): Promise<{ widthIn: number; heightIn: number }> {
    const read = async (label: string) => {
      const r = parseLength(await this.page.getByLabel(label, { exact: true }).inputValue(), 'in');
      if (!r.ok) throw new Error(`${label}: ${r.message}`);
      return r.inches;
    };
    return { widthIn: await read('Drawing width'), heightIn: await read('Drawing height') };
  }

  /** The piecing-order list. */
  orderList(): Locator {
    return this.page.getByRole('list', { name: 'Patches in sewing order' });
  }

  /** The patch labels in the piecing-order list, in sewing order. */
  async orderLabels(): Promise<string[]> {
    return this.orderList().locator('li').evaluateAll((items) => items.map((li) => li.getAttribute('data-label') ?? ''));
  }

  /** Drags the patch at `from` in the piecing-order list by its handle onto the place of `to` (CDK drag and drop). */
  async dragInList(from: number, to: number): Promise<void> {
    const items = this.orderList().locator('li');
    // The side column scrolls: bring the list into view before reading positions.
    await items.nth(Math.max(from, to)).scrollIntoViewIfNeeded();
    await items.nth(Math.min(from, to)).scrollIntoViewIfNeeded();
    const handle = (await items.nth(from).locator('.handle').boundingBox())!;
    const target = (await items.nth(to).boundingBox())!;
    const x = handle.x + handle.width / 2;
    await this.page.mouse.move(x, handle.y + handle.height / 2);
    await this.page.mouse.down();
    await this.page.mouse.move(x, handle.y + (to < from ? -10 : 10), { steps: 5 });
    await this.page.mouse.move(x, to < from ? target.y + 4 : target.y + target.height - 4, { steps: 10 });
    await this.page.mouse.up();
  }

  /** The sewability verdict of the selected section. */
  verdict(): Locator {
    return this.page.getByTestId('sewability');
  }
}
