import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { EmptyState } from '../../shared/empty-state/empty-state';
import { AuthStore } from './auth-store';

const PROBLEMS: Record<string, string> = {
  cancelled: 'Sign-in was cancelled at the company sign-on page.',
  failed: 'Sign-in did not complete. Please try again; if it keeps failing, tell your administrator.',
  unavailable: 'The company sign-on service cannot be reached right now. Try again in a minute.',
};

/** "Sign in to continue": shown in place of a page that needs a signed-in person, and after a failed sign-in. */
@Component({
  selector: 'wick-sign-in-page',
  imports: [EmptyState, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="wick-page">
      <h1>{{ area() || 'Sign in' }}</h1>
      @if (problem(); as text) {
        <p class="wick-caution" role="alert"><span>{{ text }}</span></p>
      }
      <wick-empty-state icon="login" heading="Sign in to continue">
        Use your company account{{ area() ? ' to open ' + area() : '' }}. You will come back to this page.
      </wick-empty-state>
      <div class="actions">
        <button mat-flat-button type="button" (click)="signIn()">
          <mat-icon>login</mat-icon>
          Sign in
        </button>
      </div>
    </section>
  `,
  styles: `
    h1 { font: var(--mat-sys-headline-small); }
    .actions { display: flex; justify-content: center; }
  `,
})
export class SignInPage {
  private readonly auth = inject(AuthStore);
  readonly area = input('');
  readonly returnTo = input('');
  readonly error = input('');
  protected readonly problem = computed(() => PROBLEMS[this.error()] ?? (this.error() ? PROBLEMS['failed'] : ''));

  protected signIn(): void {
    // From the guard, returnTo is the page asked for; after a failed sign-in it comes back from the server.
    this.auth.signIn(this.returnTo() || '/');
  }
}
