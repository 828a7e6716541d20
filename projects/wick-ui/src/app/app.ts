import { BreakpointObserver, Breakpoints } from '@angular/cdk/layout';
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { UserMenu } from './core/auth/user-menu';
import { AuthStore } from './core/auth/auth-store';
import { visibleNavItems } from './core/navigation';
import { WickMark } from './shared/wick-mark/wick-mark';

const THEME_KEY = 'wick-theme';

@Component({
  selector: 'wick-root',
  imports: [
    MatButtonModule,
    MatIconModule,
    MatListModule,
    MatSidenavModule,
    MatToolbarModule,
    MatTooltipModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    UserMenu,
    WickMark,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './app.html',
  styleUrl: './app.scss',
})
export class App {
  private readonly document = inject(DOCUMENT);
  private readonly auth = inject(AuthStore);
  /** Before sign-in every area is listed (opening one asks to sign in); after it, only what the roles allow. */
  protected readonly navItems = computed(() => {
    const status = this.auth.status();
    return visibleNavItems(status === 'signed-in' || status === 'no-role', (p) => this.auth.can(p));
  });
  protected readonly handset = toSignal(
    inject(BreakpointObserver)
      .observe([Breakpoints.XSmall, Breakpoints.Small])
      .pipe(map((r) => r.matches)),
    { initialValue: false },
  );
  protected readonly navOpen = signal(true);
  protected readonly sidenavOpened = computed(() => !this.handset() || this.navOpen());
  protected readonly dark = signal(this.readTheme() === 'dark');

  constructor() {
    effect(() => {
      const dark = this.dark();
      this.document.documentElement.classList.toggle('wick-dark', dark);
      try {
        localStorage.setItem(THEME_KEY, dark ? 'dark' : 'light');
      } catch {
        // Private mode or storage disabled: the choice lasts for this page only.
      }
    });
    // Collapse the drawer when switching to a small screen.
    effect(() => this.navOpen.set(!this.handset()));
  }

  protected toggleNav(): void {
    this.navOpen.update((open) => !open);
  }

  protected navigated(): void {
    if (this.handset()) this.navOpen.set(false);
  }

  private readTheme(): string | null {
    try {
      return localStorage.getItem(THEME_KEY);
    } catch {
      return null;
    }
  }
}
