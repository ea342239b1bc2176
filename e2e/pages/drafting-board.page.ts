import { expect, type Locator, type Page } from '@playwright/test';

/** A point in the pattern's inches. */
export interface InchPoint {
  x: number;
  y: number;
}

interface BoardHandle {
  editor: {
    viewport: { scale: number; originX: number; originY: number; mirrored: boolean; mirrorWidthIn: number };
    store: { document: { sections: Array<{ seams: unknown[] }> } };
  };
  renderer: { stage: { find(selector: string): Array<{ text(): string; visible(): boolean }> } };
}

/**
 * The Drafting board of `<sw-pattern-editor>` as a user drives it: tools by their keys, pointer
 * gestures at positions in inches (converted with the board's own view), the piecing-order list and
 * the sewability verdict by their roles.
 */
export class DraftingBoardPage {
  constructor(private readonly page: Page) {}

  /** The board itself (role application). */
  board(): Locator {
    return this.page.getByRole('application', { name: 'Drafting board' });
  }

  /** Waits until the board's Konva stage is up. */
  async ready(): Promise<void> {
    await expect(this.board()).toBeVisible();
    await this.page.waitForFunction(() => Boolean((document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard?: unknown })?.swBoard));
  }

  /** Screen position of a point in inches, from the board's current view. */
  async screen(p: InchPoint): Promise<InchPoint> {
    return this.page.evaluate(([x, y]) => {
      const el = document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard: BoardHandle };
      const v = el.swBoard.editor.viewport;
      const r = el.getBoundingClientRect();
      const sx = v.mirrored ? v.mirrorWidthIn - x : x;
      return { x: r.left + v.originX + sx * v.scale, y: r.top + v.originY + y * v.scale };
    }, [p.x, p.y] as const);
  }

  /** Picks a tool with its key (the board gets focus first). */
  async tool(key: string): Promise<void> {
    await this.board().focus();
    await this.page.keyboard.press(key);
    await expect(this.board()).toHaveAttribute('data-tool', /.+/);
  }

  /** Presses, drags through `via` and releases. */
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

  /** Patch labels drawn on the board (the Konva text nodes of section copy 0), sorted. */
  async boardLabels(): Promise<string[]> {
    return this.page.evaluate(() => {
      const el = document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard: BoardHandle };
      return el.swBoard.renderer.stage
        .find('.patch-label')
        .map((n) => n.text())
        .sort();
    });
  }

  /** The board's view (scale and offset), to check it did not move. */
  async viewport(): Promise<{ scale: number; originX: number; originY: number }> {
    return this.page.evaluate(() => {
      const el = document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard: BoardHandle };
      const { scale, originX, originY } = el.swBoard.editor.viewport;
      return { scale, originX, originY };
    });
  }

  /** The fabric ids of the first section's patch assignments, sorted (what the board's document holds). */
  async patchFabrics(): Promise<string[]> {
    return this.page.evaluate(() => {
      const el = document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard: { editor: { store: { document: { sections: Array<{ patches: Array<{ fabricId?: string }> }> } } } } };
      return (el.swBoard.editor.store.document.sections[0]?.patches ?? []).map((p) => p.fabricId ?? '').sort();
    });
  }

  /** The drawing area of the board's document, in inches. */
  async canvas(): Promise<{ widthIn: number; heightIn: number }> {
    return this.page.evaluate(() => {
      const el = document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard: { editor: { store: { document: { canvas: { widthIn: number; heightIn: number } } } } } };
      return el.swBoard.editor.store.document.canvas;
    });
  }

  /** Number of sections and seams in the board's document. */
  async counts(): Promise<{ sections: number; seams: number }> {
    return this.page.evaluate(() => {
      const el = document.querySelector('[aria-label="Drafting board"]') as HTMLElement & { swBoard: BoardHandle };
      const sections = el.swBoard.editor.store.document.sections;
      return { sections: sections.length, seams: sections.reduce((n, s) => n + s.seams.length, 0) };
    });
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
