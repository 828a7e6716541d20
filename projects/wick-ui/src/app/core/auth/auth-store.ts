import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { CurrentUser, Permission } from 'wick-core';
import { BrowserLocation } from './browser-location';

/** Readable cookie the server sets with the CSRF token while a session exists (server/src/auth/auth-config.ts). */
export const CSRF_COOKIE = 'wick.xsrf';
export const CSRF_HEADER = 'X-CSRF-Token';

export type AuthState =
  | { readonly status: 'unknown' }
  | { readonly status: 'anonymous' }
  /** Signed in at the provider, but holding no Wickwright role. */
  | { readonly status: 'no-role' }
  | { readonly status: 'signed-in'; readonly user: CurrentUser };

/** Who is signed in: loaded once from `GET /api/me`, then kept as signals for menus and guards. */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly http = inject(HttpClient);
  private readonly location = inject(BrowserLocation);
  private readonly state = signal<AuthState>({ status: 'unknown' });
  private loading?: Promise<void>;

  readonly status = computed(() => this.state().status);
  readonly user = computed(() => {
    const s = this.state();
    return s.status === 'signed-in' ? s.user : null;
  });
  readonly permissions = computed(() => new Set<Permission>(this.user()?.permissions ?? []));

  /**
   * Asks the server who is signed in, once (later calls share the answer). Without the CSRF cookie there is no
   * session, so an anonymous visitor costs no request; the server stays the judge either way.
   */
  load(): Promise<void> {
    this.loading ??= this.fetch();
    return this.loading;
  }

  private async fetch(): Promise<void> {
    if (!this.location.cookie(CSRF_COOKIE)) {
      this.state.set({ status: 'anonymous' });
      return;
    }
    try {
      const user = await firstValueFrom(this.http.get<CurrentUser>('/api/me'));
      this.state.set({ status: 'signed-in', user });
    } catch (e) {
      const noRole = e instanceof HttpErrorResponse && e.status === 403;
      this.state.set({ status: noRole ? 'no-role' : 'anonymous' });
    }
  }

  can(permission: Permission): boolean {
    return this.permissions().has(permission);
  }

  /** Leaves for the provider's sign-in page; the server brings the person back to `returnTo`. */
  signIn(returnTo = this.location.current()): void {
    this.location.assign(`/auth/login?returnTo=${encodeURIComponent(returnTo)}`);
  }

  /** The server answered 401 to a call: the session ended. Sign in again and come back to this page. */
  sessionLost(): void {
    if (this.state().status === 'anonymous') return;
    this.state.set({ status: 'anonymous' });
    this.signIn();
  }

  /** Ends the session here, then at the provider (which sends the browser back to the app's home page). */
  async signOut(): Promise<void> {
    let redirectTo = '/';
    try {
      redirectTo = (await firstValueFrom(this.http.post<{ redirectTo: string }>('/auth/logout', {}))).redirectTo;
    } finally {
      this.state.set({ status: 'anonymous' });
      this.location.assign(redirectTo);
    }
  }
}
