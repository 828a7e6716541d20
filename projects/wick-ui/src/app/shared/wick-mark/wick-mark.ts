import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** Wickwright's mark: a fibre strip with liquid risen part-way up, and a drop above the front. */
@Component({
  selector: 'wick-mark',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg [attr.width]="size()" [attr.height]="size()" viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect x="9" y="2" width="14" height="28" rx="3" fill="none" stroke="currentColor" stroke-width="2" />
      <path d="M10 30V17c2-1.6 4-1.6 6 0s4 1.6 6 0v13z" fill="currentColor" opacity="0.85" />
      <circle cx="16" cy="9" r="2.4" fill="currentColor" />
    </svg>
  `,
  styles: `:host { display: inline-flex; }`,
})
export class WickMark {
  readonly size = input(28);
}
