import { provideHttpClient, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { CurrentUser } from 'wick-core';
import { authInterceptor } from './auth-interceptor';
import { AuthStore, CSRF_COOKIE, CSRF_HEADER } from './auth-store';
import { BrowserLocation } from './browser-location';

const ENGINEER: CurrentUser = {
  id: 1,
  subject: 'bwh-1001',
  name: 'Priya Raman',
  email: 'priya.raman@brightwell.example',
  roles: ['engineer'],
  permissions: ['library:read', 'compute:run', 'designs:read', 'designs:edit'],
};

class FakeLocation {
  cookies: Record<string, string> = {};
  page = '/designs?tab=stack';
  assigned: string[] = [];
  assign(url: string): void {
    this.assigned.push(url);
  }
  current(): string {
    return this.page;
  }
  cookie(name: string): string | null {
    return this.cookies[name] ?? null;
  }
}

describe('AuthStore', () => {
  let store: AuthStore;
  let http: HttpTestingController;
  let location: FakeLocation;

  beforeEach(() => {
    location = new FakeLocation();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withXsrfConfiguration({ cookieName: CSRF_COOKIE, headerName: CSRF_HEADER }), withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        { provide: BrowserLocation, useValue: location },
      ],
    });
    store = TestBed.inject(AuthStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('is anonymous without asking the server when there is no session cookie', async () => {
    await store.load();
    expect(store.status()).toBe('anonymous');
    expect(store.user()).toBeNull();
  });

  it('loads the person and their permissions from /api/me when a session exists', async () => {
    location.cookies[CSRF_COOKIE] = 'token';
    const loading = store.load();
    http.expectOne('/api/me').flush(ENGINEER);
    await loading;
    expect(store.status()).toBe('signed-in');
    expect(store.user()?.name).toBe('Priya Raman');
    expect(store.can('designs:edit')).toBeTrue();
    expect(store.can('users:manage')).toBeFalse();
    // A second call shares the first answer.
    await store.load();
    http.expectNone('/api/me');
  });

  it('treats 401 from /api/me as anonymous (expired session) and 403 as signed in without a role', async () => {
    location.cookies[CSRF_COOKIE] = 'token';
    const loading = store.load();
    http.expectOne('/api/me').flush({ error: { code: 'no-role' } }, { status: 403, statusText: 'Forbidden' });
    await loading;
    expect(store.status()).toBe('no-role');
    expect(location.assigned).toEqual([]);
  });

  it('signs in through the server, keeping the current page as the way back', () => {
    store.signIn();
    expect(location.assigned).toEqual([`/auth/login?returnTo=${encodeURIComponent('/designs?tab=stack')}`]);
  });

  it('signs out with a POST carrying the CSRF header, then follows the provider’s end-session address', async () => {
    location.cookies[CSRF_COOKIE] = 'token';
    document.cookie = `${CSRF_COOKIE}=csrf-123; path=/`;
    const loading = store.load();
    http.expectOne('/api/me').flush(ENGINEER);
    await loading;
    const out = store.signOut();
    const req = http.expectOne('/auth/logout');
    expect(req.request.method).toBe('POST');
    expect(req.request.headers.get(CSRF_HEADER)).toBe('csrf-123');
    req.flush({ redirectTo: 'http://127.0.0.1:4611/session/end?client_id=wickwright' });
    await out;
    expect(store.status()).toBe('anonymous');
    expect(location.assigned).toEqual(['http://127.0.0.1:4611/session/end?client_id=wickwright']);
    document.cookie = `${CSRF_COOKIE}=; expires=Thu, 01 Jan 1970 00:00:00 GMT; path=/`;
  });
});
