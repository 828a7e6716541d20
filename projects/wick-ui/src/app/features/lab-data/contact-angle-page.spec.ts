import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { LabSetSummary } from 'wick-core';
import { ContactAnglePage } from './contact-angle-page';
import { labSet } from './testing';

describe('ContactAnglePage', () => {
  let http: HttpTestingController;
  afterEach(() => http.verify());

  function summary(id: number, liquidName: string, webId = 7): LabSetSummary {
    const { runs: _r, figures: _f, warnings: _w, actions: _a, ...s } = labSet({ id, liquidName, webId, name: `Set ${id}` });
    return s;
  }

  async function open(query: Record<string, string>) {
    TestBed.configureTestingModule({ imports: [ContactAnglePage], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ContactAnglePage);
    for (const [k, v] of Object.entries(query)) fixture.componentRef.setInput(k, v);
    fixture.detectChanges();
    http.expectOne('/api/lab-data/sets').flush([summary(1, 'n-Hexane'), summary(2, '0.9 % NaCl saline'), summary(3, 'Water', 8)]);
    // ngModel writes to the selects a turn later; then they show the chosen option.
    for (let i = 0; i < 2; i++) {
      await fixture.whenStable();
      fixture.detectChanges();
    }
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  it('starts from the reference set in the address and picks the only test set of the same web', async () => {
    const { el } = await open({ reference: '1' });
    const selects = el.querySelectorAll('mat-select');
    expect(selects[0].textContent).toContain('n-Hexane');
    expect(selects[1].textContent).toContain('0.9 % NaCl saline');
    expect((el.querySelector('button[mat-flat-button]') as HTMLButtonElement).disabled).toBeFalse();
  });

  it('ignores a set id that does not exist', async () => {
    const { el } = await open({ reference: '99', test: '2' });
    expect(el.querySelectorAll('mat-select')[0].textContent?.trim()).toBe('');
    expect((el.querySelector('button[mat-flat-button]') as HTMLButtonElement).disabled).toBeTrue();
  });
});
