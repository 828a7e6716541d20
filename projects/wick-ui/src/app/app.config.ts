import { provideHttpClient, withFetch, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import { ApplicationConfig, inject, provideAppInitializer, provideBrowserGlobalErrorListeners } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { routes } from './app.routes';
import { authInterceptor } from './core/auth/auth-interceptor';
import { AuthStore, CSRF_COOKIE, CSRF_HEADER } from './core/auth/auth-store';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideRouter(routes, withComponentInputBinding()),
    // Angular's XSRF interceptor copies the session's CSRF token from its cookie into the header on every
    // same-origin request that changes data; authInterceptor turns a 401 into a return to sign-in.
    provideHttpClient(
      withFetch(),
      withXsrfConfiguration({ cookieName: CSRF_COOKIE, headerName: CSRF_HEADER }),
      withInterceptors([authInterceptor]),
    ),
    // Menus and guards know who is signed in before the first page renders.
    provideAppInitializer(() => inject(AuthStore).load()),
    // Icons come from the bundled Material Symbols font, never from a font host.
    provideAppInitializer(() => {
      inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
    }),
  ],
};
