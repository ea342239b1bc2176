import type { MatDialog, MatDialogRef } from '@angular/material/dialog';
import { KeyboardHelpDialogComponent } from './keyboard-help-dialog.component';

/** Opens the keyboard help; when it closes, focus goes back to what had it (the board). */
export function openKeyboardHelp(dialog: MatDialog): MatDialogRef<KeyboardHelpDialogComponent> {
  return dialog.open(KeyboardHelpDialogComponent, { restoreFocus: true, width: '560px', maxWidth: '95vw' });
}
