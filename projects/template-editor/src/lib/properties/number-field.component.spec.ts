import { TestBed } from '@angular/core/testing';
import { Component, signal } from '@angular/core';
import { NumberFieldComponent, readNumberField } from './number-field.component';

describe('readNumberField', () => {
  it('reads lengths as quilters write them, in inches', () => {
    expect(readNumberField('2 3/4', 'length', 'in', 0, 100)).toEqual({ ok: true, value: 2.75 });
    expect(readNumberField('2¾', 'length', 'in', 0, 100)).toEqual({ ok: true, value: 2.75 });
    // 7 cm = 7 / 2.54 in. (1 in. = 2.54 cm exactly, NIST HB 44).
    const cm = readNumberField('7 cm', 'length', 'in', 0, 100);
    expect(cm.ok && cm.value).toBeCloseTo(7 / 2.54, 12);
    // A bare number on a cm board is centimetres.
    const bare = readNumberField('2.54', 'length', 'cm', 0, 100);
    expect(bare.ok && bare.value).toBeCloseTo(1, 12);
  });

  it('says what is wrong with text that is not a length, or out of range', () => {
    const r = readNumberField('two', 'length', 'in', 0, 100);
    expect(r.ok).toBe(false);
    expect(readNumberField('0.01', 'length', 'in', 0.0625, 100)).toEqual({ ok: false, message: 'must be at least 1/16 in.' });
    expect(readNumberField('400', 'angle', 'in', 0.1, 360)).toEqual({ ok: false, message: 'must be at most 360°' });
    expect(readNumberField('2.5', 'count', 'in', 2, 360)).toEqual({ ok: false, message: 'enter a whole number' });
  });
});

@Component({
  imports: [NumberFieldComponent],
  template: `<sw-number-field label="Outer radius" [value]="value()" (valueChange)="changes.push($event); value.set($event)" />`,
})
class HostComponent {
  readonly value = signal(8);
  readonly changes: number[] = [];
}

@Component({
  imports: [NumberFieldComponent],
  template: `<sw-number-field label="Start angle (°)" kind="angle" [value]="angle()" (valueChange)="changes.push($event)" />
    <sw-number-field label="Corner x" [value]="length()" (valueChange)="changes.push($event)" />`,
})
class DecimalsHostComponent {
  readonly angle = signal(247.380135);
  readonly length = signal(1 / 3);
  readonly changes: number[] = [];
}

describe('NumberFieldComponent', () => {
  it('shows at most 3 decimals and never writes the rounded value back untouched', async () => {
    const fixture = TestBed.createComponent(DecimalsHostComponent);
    fixture.detectChanges();
    await fixture.whenStable();
    const angle = fixture.nativeElement.querySelector('input[aria-label="Start angle (°)"]') as HTMLInputElement;
    const length = fixture.nativeElement.querySelector('input[aria-label="Corner x"]') as HTMLInputElement;
    expect(angle.value).toBe('247.38');
    expect(length.value).toBe('0.333');
    angle.dispatchEvent(new Event('blur'));
    length.dispatchEvent(new Event('blur'));
    fixture.detectChanges();
    await fixture.whenStable();
    expect(fixture.componentInstance.changes).toEqual([]);
  });

  it('shows the value as quilters write it, emits inches on Enter and explains bad input', async () => {
    const fixture = TestBed.createComponent(HostComponent);
    fixture.detectChanges();
    await fixture.whenStable();
    const input = fixture.nativeElement.querySelector('input[aria-label="Outer radius"]') as HTMLInputElement;
    expect(input.value).toBe('8');
    input.value = '8 1/2';
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    fixture.detectChanges();
    await fixture.whenStable();
    expect(fixture.componentInstance.changes).toEqual([8.5]);
    expect(input.value).toBe('8 1/2');
    input.value = '8 and a bit';
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    fixture.detectChanges();
    await fixture.whenStable();
    const error = fixture.nativeElement.querySelector('mat-error') as HTMLElement | null;
    expect(error?.textContent?.trim().length).toBeGreaterThan(5);
    expect(fixture.componentInstance.changes).toEqual([8.5]);
  });
});
