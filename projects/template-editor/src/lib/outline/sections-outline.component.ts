import { ChangeDetectionStrategy, Component, ElementRef, computed, effect, inject, signal, untracked } from '@angular/core';
import { EditorSession } from '../session/editor-session';
import { outlineItems, selectionKey, visibleItems, type OutlineItem } from './outline-items';

/**
 * The Sections outline: the board's drawing as a tree a keyboard and a screen reader can walk. One
 * item per section ("B, arc section, 4 patches") with its patches as child items. Up and Down move,
 * Right opens a section or enters it, Left closes it or goes back to its section, Home and End jump;
 * Enter (or Space) selects the item on the board and keeps focus here. Selecting on the board moves
 * the outline's current item. One Tab stop (roving tabindex, as the WAI-ARIA tree pattern asks).
 */
@Component({
  selector: 'sw-sections-outline',
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sections-outline.component.html',
  styleUrl: './sections-outline.component.scss',
})
export class SectionsOutlineComponent {
  protected readonly session = inject(EditorSession);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** Sections, each with its patches. */
  protected readonly items = computed(() => outlineItems(this.session.document(), this.session.editor.analysis));
  /** Keys of the sections whose patches are hidden. */
  protected readonly collapsed = signal<ReadonlySet<string>>(new Set());
  /** The item that holds the tree's one Tab stop. */
  private readonly current = signal<string | null>(null);
  /** The key of the item that stands for the board's selection. */
  protected readonly selectedKey = computed(() => selectionKey(this.session.selection()));
  private readonly visible = computed(() => visibleItems(this.items(), this.collapsed()));
  /** The current item, or the selected one, or the first, whichever is shown. */
  protected readonly tabKey = computed(() => {
    const keys = new Set(this.visible().map((i) => i.key));
    const c = this.current();
    if (c && keys.has(c)) return c;
    const sel = this.selectedKey();
    if (sel && keys.has(sel)) return sel;
    return this.visible()[0]?.key ?? null;
  });

  constructor() {
    effect(() => {
      // Selecting on the board moves the outline's current item there (opening its section).
      const key = this.selectedKey();
      const sectionId = this.session.selection().sectionId;
      if (!key || !sectionId) return;
      untracked(() => {
        const sectionKey = `s:${sectionId}`;
        if (key !== sectionKey && this.collapsed().has(sectionKey)) this.setCollapsed(sectionKey, false);
        this.current.set(key);
      });
    });
  }

  protected isExpanded(item: OutlineItem): boolean | null {
    return item.children.length === 0 ? null : !this.collapsed().has(item.key);
  }

  /** Selects an item on the board (a click or Enter); focus stays in the outline. */
  protected choose(item: OutlineItem, event?: Event): void {
    event?.stopPropagation();
    this.current.set(item.key);
    this.session.editor.store.select({ sectionId: item.sectionId, patchIndex: item.patchIndex });
  }

  protected toggle(item: OutlineItem, event: Event): void {
    event.stopPropagation();
    this.setCollapsed(item.key, !this.collapsed().has(item.key));
  }

  protected onFocus(item: OutlineItem, event: FocusEvent): void {
    event.stopPropagation();
    this.current.set(item.key);
  }

  protected onKeyDown(event: KeyboardEvent): void {
    if (event.ctrlKey || event.metaKey || event.altKey) return;
    const list = this.visible();
    const i = list.findIndex((it) => it.key === this.tabKey());
    const item = list[i];
    if (!item) return;
    let next: OutlineItem | undefined;
    switch (event.key) {
      case 'ArrowDown':
        next = list[Math.min(list.length - 1, i + 1)];
        break;
      case 'ArrowUp':
        next = list[Math.max(0, i - 1)];
        break;
      case 'Home':
        next = list[0];
        break;
      case 'End':
        next = list[list.length - 1];
        break;
      case 'ArrowRight':
        if (item.children.length > 0 && this.collapsed().has(item.key)) this.setCollapsed(item.key, false);
        else next = item.children[0] ?? item;
        break;
      case 'ArrowLeft':
        if (item.parentKey) next = list.find((it) => it.key === item.parentKey);
        else if (item.children.length > 0) this.setCollapsed(item.key, true);
        break;
      case 'Enter':
      case ' ':
        this.choose(item);
        break;
      default:
        return;
    }
    event.preventDefault();
    // A patch item sits inside its section's item: the key is handled once.
    event.stopPropagation();
    if (next) this.moveTo(next.key);
  }

  private moveTo(key: string): void {
    this.current.set(key);
    const items = this.host.nativeElement.querySelectorAll<HTMLElement>('[role="treeitem"]');
    [...items].find((el) => el.dataset['key'] === key)?.focus();
  }

  private setCollapsed(key: string, collapsed: boolean): void {
    this.collapsed.update((set) => {
      const next = new Set(set);
      if (collapsed) next.add(key);
      else next.delete(key);
      return next;
    });
  }
}
