import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { EmptyState } from '../../shared/empty-state/empty-state';

/** An honest placeholder for an area whose screens are not built yet (route data gives the words). */
@Component({
  selector: 'wick-planned-feature',
  imports: [EmptyState],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <h1>{{ title() }}</h1>
      <wick-empty-state icon="construction" heading="Not built yet">
        {{ arrivesWith() }}
      </wick-empty-state>
    </section>
  `,
  styles: `h1 { font: var(--mat-sys-headline-small); }`,
})
export class PlannedFeature {
  readonly title = input('');
  readonly arrivesWith = input('');
}
