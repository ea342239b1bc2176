import { patternFileName } from './pattern-file-name';

describe('patternFileName', () => {
  it('keeps a plain title, letters of every script and inner dots', () => {
    expect(patternFileName('Orchard Wheel', '.svg')).toBe('Orchard Wheel.svg');
    expect(patternFileName('Étoile du Nord · 北斗', '.png')).toBe('Étoile du Nord · 北斗.png');
    expect(patternFileName('v1.2 sampler', '.seamwright.json')).toBe('v1.2 sampler.seamwright.json');
  });

  it('turns characters that no system accepts into spaces, and collapses spaces', () => {
    expect(patternFileName('Log/Cabin: "Red" <2>?*|\\', '.svg')).toBe('Log Cabin Red 2.svg');
    expect(patternFileName('tab\there\nnew line', '.svg')).toBe('tab here new line.svg');
  });

  it('drops leading and trailing dots and spaces, so no hidden file and no path step', () => {
    expect(patternFileName('../../etc/passwd', '.svg')).toBe('etc passwd.svg');
    expect(patternFileName(' .hidden. ', '.svg')).toBe('hidden.svg');
  });

  it('never answers an empty name or a device name', () => {
    expect(patternFileName('', '.svg')).toBe('pattern.svg');
    expect(patternFileName(' ... ', '.svg')).toBe('pattern.svg');
    expect(patternFileName('CON', '.svg')).toBe('_CON.svg');
    expect(patternFileName('lpt1', '.png')).toBe('_lpt1.png');
    expect(patternFileName('Console', '.png')).toBe('Console.png');
  });

  it('cuts a long title to 80 characters without splitting a character', () => {
    const name = patternFileName('Log cabin '.repeat(20), '.svg');
    expect(name).toBe('Log cabin '.repeat(8).trim() + '.svg');
  });

  it('cuts a title in a many-byte script to 200 bytes, so the name stays within the 255 bytes systems allow', () => {
    // Each 🧵 is 4 bytes of UTF-8: 50 of them make 200 bytes.
    const name = patternFileName('🧵'.repeat(120), '.seamwright.json');
    expect(name).toBe('🧵'.repeat(50) + '.seamwright.json');
    expect(new TextEncoder().encode(name).length).toBeLessThanOrEqual(255);
  });
});
