import { expect, type Download, type Locator, type Page } from '@playwright/test';
import { readFile } from 'node:fs/promises';

/** A file the browser downloaded: its suggested name and its bytes. */
export interface DownloadedFile {
  name: string;
  bytes: Buffer;
}

/**
 * Pattern files as a user meets them: "Open a pattern file" on the pattern list (through the browser's
 * file chooser) with its list of problems, and the board's Download menu.
 */
export class PatternFilesPage {
  constructor(private readonly page: Page) {}

  /** Chooses a file with "Open a pattern file", as a person does: the button, then the file chooser. */
  async open(name: string, content: string): Promise<void> {
    const chooser = this.page.waitForEvent('filechooser');
    await this.page.getByRole('button', { name: 'Open a pattern file' }).click();
    await (await chooser).setFiles({ name, mimeType: 'application/json', buffer: Buffer.from(content) });
  }

  /** The alert that lists the problems of a file that was not opened. */
  problems(): Locator {
    return this.page.getByRole('alert').filter({ hasText: 'was not opened' });
  }

  /** The problems as written in the list: `path: message`. */
  async problemLines(): Promise<string[]> {
    await expect(this.problems()).toBeVisible();
    return (await this.problems().getByRole('listitem').allTextContents()).map((t) => t.trim());
  }

  /** Picks an entry of the board's Download menu and answers the file the browser saves. */
  async download(entry: 'Pattern file (.seamwright.json)' | 'Front view as SVG' | 'Front view as PNG'): Promise<DownloadedFile> {
    await this.page.getByRole('button', { name: 'Download', exact: true }).click();
    const downloading = this.page.waitForEvent('download');
    await this.page.getByRole('menuitem', { name: entry }).click();
    return this.read(await downloading);
  }

  /** Entries the Download menu offers (the menu is closed again with Escape). */
  async menuEntries(): Promise<string[]> {
    await this.page.getByRole('button', { name: 'Download', exact: true }).click();
    const entries = (await this.page.getByRole('menuitem').allTextContents()).map((t) => t.replace(/^\s*[a-z_]+\s*/, '').trim());
    await this.page.keyboard.press('Escape');
    return entries;
  }

  private async read(download: Download): Promise<DownloadedFile> {
    const path = await download.path();
    return { name: download.suggestedFilename(), bytes: await readFile(path) };
  }
}
