import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { FieldIssue } from '../core/api-error';

/** Passwords shorter than this are refused (the server checks the same). */
export const MIN_PASSWORD_LENGTH = 10;

/** The message shown under a field for its first error. */
export function fieldMessage(label: string, control: AbstractControl | null): string {
  const e = control?.errors;
  if (!e) return '';
  if (e['required']) return `${label} is required`;
  if (e['email']) return 'Enter an e-mail address like name@example.com';
  if (e['minlength']) return `${label} must be at least ${e['minlength'].requiredLength} characters`;
  if (e['maxlength']) return `${label} must be at most ${e['maxlength'].requiredLength} characters`;
  if (e['mismatch']) return 'The two passwords do not match';
  if (e['server']) return String(e['server']);
  return `${label} is not valid`;
}

/** Form-level check that `a` and `b` hold the same value; marks `b`. */
export function sameAs(a: string, b: string): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const second = group.get(b);
    if (!second) return null;
    const mismatch = group.get(a)?.value !== second.value && second.value !== '';
    const others = { ...(second.errors ?? {}) };
    delete others['mismatch'];
    second.setErrors(mismatch ? { ...others, mismatch: true } : Object.keys(others).length ? others : null);
    return null;
  };
}

/** Puts the server's field issues on the matching controls; returns the ones no control took. */
export function applyServerIssues(form: AbstractControl, issues: FieldIssue[]): FieldIssue[] {
  const rest: FieldIssue[] = [];
  for (const issue of issues) {
    const control = issue.path ? form.get(issue.path) : null;
    if (control) {
      control.setErrors({ ...(control.errors ?? {}), server: issue.message });
      control.markAsTouched();
    } else rest.push(issue);
  }
  return rest;
}
