import type { ComponentFixture } from '@angular/core/testing';

/**
 * Drives a Material form in a component test the way a person would: types into the field with a
 * given label (input, then blur), presses the submit button, reads the errors shown.
 * For specs only; the app never imports it.
 */
export function formDriver(fixture: ComponentFixture<unknown>) {
  const el = fixture.nativeElement as HTMLElement;
  const field = (label: string) => {
    const found = Array.from(el.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim() === label);
    if (!found) throw new Error(`no field labelled "${label}"`);
    return found;
  };
  const type = (label: string, value: string) => {
    const input = field(label).querySelector('input') as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  };
  const submit = async () => {
    (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
    await fixture.whenStable();
  };
  const errors = () => Array.from(el.querySelectorAll('mat-error')).map((e) => e.textContent?.trim());
  const errorOf = (label: string) => field(label).querySelector('mat-error')?.textContent?.trim() ?? '';
  const values = () => Array.from(el.querySelectorAll('input')).map((i) => i.value);
  return { el, field, type, submit, errors, errorOf, values };
}
