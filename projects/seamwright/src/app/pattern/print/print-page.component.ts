import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Print part of the pattern page. */
@Component({ selector: 'sw-print-page', changeDetection: ChangeDetectionStrategy.OnPush, template: `<p>Print</p>` })
export class PrintPageComponent {}
