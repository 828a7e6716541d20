import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import type { CurrentUser } from 'wick-core';
import { AuthStore, type AuthState } from './auth-store';
import { UserMenu } from './user-menu';

const LENA: CurrentUser = {
  id: 6,
  subject: 'bwh-1006',
  name: 'Lena Moreau',
  email: 'lena.moreau@brightwell.example',
  roles: ['materials-scientist', 'reviewer'],
  permissions: [],
};

function setup(status: AuthState['status'], user: CurrentUser | null = null) {
  const store = {
    status: signal(status),
    user: signal(user),
    signIn: jasmine.createSpy('signIn'),
    signOut: jasmine.createSpy('signOut'),
  };
  TestBed.configureTestingModule({ imports: [UserMenu], providers: [{ provide: AuthStore, useValue: store }] });
  const fixture = TestBed.createComponent(UserMenu);
  return { store, fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('UserMenu', () => {
  it('offers "Sign in" to an anonymous visitor', async () => {
    const { store, loader } = setup('anonymous');
    const button = await loader.getHarness(MatButtonHarness.with({ text: /Sign in/ }));
    await button.click();
    expect(store.signIn).toHaveBeenCalled();
  });

  it('shows the name, and a menu with the email, every role and "Sign out"', async () => {
    const { store, loader } = setup('signed-in', LENA);
    const menu = await loader.getHarness(MatMenuHarness);
    expect(await menu.getTriggerText()).toContain('Lena Moreau');
    await menu.open();
    const panel = document.querySelector('.mat-mdc-menu-panel')!.textContent!;
    expect(panel).toContain('lena.moreau@brightwell.example');
    expect(panel).toContain('Materials scientist');
    expect(panel).toContain('Reviewer');
    await menu.clickItem({ text: /Sign out/ });
    expect(store.signOut).toHaveBeenCalled();
  });
});
