import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { authInterceptor } from './auth-interceptor';
import { AuthStore } from './auth-store';

describe('authInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let store: jasmine.SpyObj<AuthStore>;

  beforeEach(() => {
    store = jasmine.createSpyObj<AuthStore>('AuthStore', ['sessionLost']);
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
        { provide: AuthStore, useValue: store },
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('turns a 401 from the API into a return to sign-in, and still reports the error to the caller', async () => {
    const call = firstValueFrom(http.get('/api/library/entries'));
    backend.expectOne('/api/library/entries').flush({ error: { code: 'unauthenticated' } }, { status: 401, statusText: 'Unauthorized' });
    await expectAsync(call).toBeRejected();
    expect(store.sessionLost).toHaveBeenCalledTimes(1);
  });

  it('leaves /api/me (the store’s own question) and other errors alone', async () => {
    const me = firstValueFrom(http.get('/api/me'));
    backend.expectOne('/api/me').flush({}, { status: 401, statusText: 'Unauthorized' });
    await expectAsync(me).toBeRejected();
    const forbidden = firstValueFrom(http.get('/api/admin/users'));
    backend.expectOne('/api/admin/users').flush({}, { status: 403, statusText: 'Forbidden' });
    await expectAsync(forbidden).toBeRejected();
    expect(store.sessionLost).not.toHaveBeenCalled();
  });
});
