import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { type ApplicationConfig, inject, provideAppInitializer, provideBrowserGlobalErrorListeners } from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, type MatFormFieldDefaultOptions } from '@angular/material/form-field';
import { MAT_ICON_DEFAULT_OPTIONS, type MatIconDefaultOptions } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { routes } from './app.routes';
import { csrfInterceptor } from './core/http/csrf-interceptor';
import { errorInterceptor } from './core/http/error-interceptor';
import { Session } from './core/session/session';
import { provideStatusTones } from './ui/status-tones';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    // Component input binding lets pages take route and query parameters (e.g. returnUrl)
    // as plain signal inputs instead of reading ActivatedRoute.
    provideRouter(routes, withComponentInputBinding()),
    // Order matters: the CSRF header is added before the error interceptor sees the answer.
    provideHttpClient(withInterceptors([csrfInterceptor, errorInterceptor])),
    // Guards need to know who is signed in before the first navigation.
    provideAppInitializer(() => inject(Session).load()),
    // Status colours come from shared/status-colours.ts, the same values the bench sheet prints.
    provideStatusTones(),
    // The icon font comes from the `material-icons` npm package (filled set), never a CDN.
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-icons' } satisfies MatIconDefaultOptions },
    {
      provide: MAT_FORM_FIELD_DEFAULT_OPTIONS,
      useValue: { appearance: 'outline', subscriptSizing: 'dynamic' } satisfies MatFormFieldDefaultOptions,
    },
  ],
};
