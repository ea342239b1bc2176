import { TestBed } from '@angular/core/testing';
import { ThemeService } from './theme.service';

describe('ThemeService', () => {
  beforeEach(() => {
    localStorage.clear();
    document.documentElement.classList.remove('sw-dark');
  });

  it('starts from a saved choice and puts the dark class on <html>', async () => {
    localStorage.setItem('sw-theme', 'dark');
    const theme = TestBed.inject(ThemeService);
    expect(theme.theme()).toBe('dark');
    TestBed.tick();
    expect(document.documentElement.classList.contains('sw-dark')).toBe(true);
  });

  it('toggles, remembers the choice and takes the class off again', () => {
    localStorage.setItem('sw-theme', 'light');
    const theme = TestBed.inject(ThemeService);
    theme.toggle();
    TestBed.tick();
    expect(document.documentElement.classList.contains('sw-dark')).toBe(true);
    expect(localStorage.getItem('sw-theme')).toBe('dark');
    theme.toggle();
    TestBed.tick();
    expect(document.documentElement.classList.contains('sw-dark')).toBe(false);
    expect(localStorage.getItem('sw-theme')).toBe('light');
  });
});
