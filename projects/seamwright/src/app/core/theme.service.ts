import { DOCUMENT } from '@angular/common';
import { Injectable, effect, inject, signal } from '@angular/core';

const KEY = 'sw-theme';
export type ThemeChoice = 'light' | 'dark';

/** Light or dark look; remembers the choice and starts from the system preference. */
@Injectable({ providedIn: 'root' })
export class ThemeService {
  private readonly doc = inject(DOCUMENT);
  /** The theme in use. */
  readonly theme = signal<ThemeChoice>(this.initial());

  constructor() {
    effect(() => {
      const dark = this.theme() === 'dark';
      this.doc.documentElement.classList.toggle('sw-dark', dark);
      try {
        localStorage.setItem(KEY, this.theme());
      } catch {
        // Storage may be blocked; the choice then lasts for this visit.
      }
    });
  }

  toggle(): void {
    this.theme.update((t) => (t === 'dark' ? 'light' : 'dark'));
  }

  private initial(): ThemeChoice {
    try {
      const saved = localStorage.getItem(KEY);
      if (saved === 'dark' || saved === 'light') return saved;
    } catch {
      // fall through to the system preference
    }
    return typeof matchMedia === 'function' && matchMedia('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
  }
}
