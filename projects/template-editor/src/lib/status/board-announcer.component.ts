import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { EditorSession } from '../session/editor-session';
import { TOOL_CATALOGUE } from '../toolbar/tool-catalogue';

/**
 * The editor's one polite live region: says what is selected and what each key did ("Section B moved
 * ⅛ in. right", "Patch A2 selected", "Undone: move section B") and which tool was picked. The words
 * come from the editor core; the same message twice in a row is still said (a space toggles).
 */
@Component({
  selector: 'sw-board-announcer',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<div class="message" role="status" aria-live="polite" aria-atomic="true">{{ text() }}</div>`,
  styles: `
    :host { display: block; min-width: 0; }
    .message { overflow: hidden; text-overflow: ellipsis; white-space: nowrap; }
  `,
})
export class BoardAnnouncerComponent {
  private readonly session = inject(EditorSession);
  private readonly message = signal('');
  private count = 0;
  /** What the region says now. */
  protected readonly text = signal('');

  constructor() {
    const stop = this.session.editor.onAnnounce((m) => this.say(m));
    inject(DestroyRef).onDestroy(stop);
    let first = true;
    effect(() => {
      const id = this.session.toolId();
      if (first) {
        first = false;
        return;
      }
      untracked(() => {
        const name = TOOL_CATALOGUE.find((t) => t.id === id)?.name ?? id;
        this.say(`${name} tool: ${this.session.toolHint()}`);
      });
    });
  }

  /** The last message said, without the toggling space. */
  get lastMessage(): string {
    return this.message();
  }

  private say(message: string): void {
    this.count++;
    this.message.set(message);
    this.text.set(this.count % 2 === 0 ? `${message}\u00a0` : message);
  }
}
