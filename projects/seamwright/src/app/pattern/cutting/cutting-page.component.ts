import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Cutting list part of the pattern page. */
@Component({ selector: 'sw-cutting-page', changeDetection: ChangeDetectionStrategy.OnPush, template: `<p>Cutting list</p>` })
export class CuttingPageComponent {}
