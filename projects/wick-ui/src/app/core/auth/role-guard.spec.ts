import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Permission } from 'wick-core';
import { AuthStore, type AuthState } from './auth-store';
import { roleGuard } from './role-guard';

@Component({ template: '<h1>Review queue page</h1>' })
class ReviewPage {}

@Component({ template: '<p>sign-in stand-in</p>' })
class SignInStandIn {}

@Component({ template: '<p>forbidden stand-in</p>' })
class ForbiddenStandIn {}

function fakeStore(status: AuthState['status'], permissions: Permission[] = []) {
  return {
    status: signal(status),
    load: () => Promise.resolve(),
    can: (p: Permission) => permissions.includes(p),
  };
}

async function open(store: ReturnType<typeof fakeStore>) {
  TestBed.configureTestingModule({
    providers: [
      { provide: AuthStore, useValue: store },
      provideRouter([
        { path: 'reviews', component: ReviewPage, canActivate: [roleGuard('library:review')], data: { title: 'Review queue' } },
        { path: 'sign-in', component: SignInStandIn },
        { path: 'forbidden', component: ForbiddenStandIn },
      ]),
    ],
  });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl('/reviews');
  return { harness, router: TestBed.inject(Router) };
}

describe('roleGuard', () => {
  it('opens the page for a role that holds the permission', async () => {
    const { harness } = await open(fakeStore('signed-in', ['library:review']));
    expect(harness.routeNativeElement?.textContent).toContain('Review queue page');
  });

  it('shows the 403 page, naming the permission and the area, at the same address for a role without it', async () => {
    const { harness, router } = await open(fakeStore('signed-in', ['library:read']));
    expect(harness.routeNativeElement?.textContent).toContain('forbidden stand-in');
    const tree = router.parseUrl(router.url);
    expect(tree.queryParams).toEqual({ need: 'library:review', area: 'Review queue' });
    expect(TestBed.inject(Router).lastSuccessfulNavigation()?.extras.browserUrl?.toString()).toBe('/reviews');
  });

  it('shows the sign-in page for an anonymous visitor, remembering where they wanted to go', async () => {
    const { harness, router } = await open(fakeStore('anonymous'));
    expect(harness.routeNativeElement?.textContent).toContain('sign-in stand-in');
    expect(router.parseUrl(router.url).queryParams).toEqual({ returnTo: '/reviews', area: 'Review queue' });
  });

  it('refuses a person without any Wickwright role', async () => {
    const { harness } = await open(fakeStore('no-role'));
    expect(harness.routeNativeElement?.textContent).toContain('forbidden stand-in');
  });
});
