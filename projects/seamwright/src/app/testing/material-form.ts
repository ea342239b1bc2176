import { parallel, type HarnessLoader } from '@angular/cdk/testing';
import { MatErrorHarness, MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';

/**
 * Types each value into the Material input whose label is its key, then leaves the field, the way a
 * person fills a form (Angular Material's own component harnesses do the typing). For specs only.
 */
export async function fillIn(loader: HarnessLoader, values: Record<string, string>): Promise<void> {
  for (const [label, value] of Object.entries(values)) {
    const input = await loader.getHarness(MatInputHarness.with({ label }));
    await input.setValue(value);
    await input.blur();
  }
}

/** Every error text the form shows, top to bottom. */
export async function shownErrors(loader: HarnessLoader): Promise<string[]> {
  const errors = await loader.getAllHarnesses(MatErrorHarness);
  return parallel(() => errors.map((e) => e.getText()));
}

/** The error texts shown under the field with this label. */
export async function errorsUnder(loader: HarnessLoader, label: string): Promise<string[]> {
  return (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();
}
