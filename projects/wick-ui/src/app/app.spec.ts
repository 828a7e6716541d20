import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatNavListItemHarness } from '@angular/material/list/testing';
import { App } from './app';
import { routes } from './app.routes';
import { NAV_ITEMS } from './core/navigation';

describe('App shell', () => {
  beforeEach(async () => {
    await TestBed.configureTestingModule({ imports: [App], providers: [provideRouter(routes)] }).compileComponents();
  });

  it('shows the product name and one navigation entry per feature area', async () => {
    const fixture = TestBed.createComponent(App);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('.brand')?.textContent).toContain('Wickwright');
    const items = await loader.getAllHarnesses(MatNavListItemHarness);
    const titles = await Promise.all(items.map((i) => i.getTitle()));
    expect(titles).toEqual(NAV_ITEMS.map((n) => n.label));
  });

  it('switches to the dark theme and remembers the choice', async () => {
    const fixture = TestBed.createComponent(App);
    await fixture.whenStable();
    const button = (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('button[aria-label="Use dark theme"]');
    button!.click();
    await fixture.whenStable();
    expect(document.documentElement.classList.contains('wick-dark')).toBeTrue();
    expect(localStorage.getItem('wick-theme')).toBe('dark');
    document.documentElement.classList.remove('wick-dark');
    localStorage.removeItem('wick-theme');
  });
});
