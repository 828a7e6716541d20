import { DOCUMENT } from '@angular/common';
import { Injectable, inject } from '@angular/core';

/** Full-page navigation (sign-in and sign-out leave the app for the identity provider); replaced in tests. */
@Injectable({ providedIn: 'root' })
export class BrowserLocation {
  private readonly document = inject(DOCUMENT);

  assign(url: string): void {
    this.document.location.assign(url);
  }

  /** The page as the address bar shows it: path, query and fragment. */
  current(): string {
    const { pathname, search, hash } = this.document.location;
    return pathname + search + hash;
  }

  cookie(name: string): string | null {
    const prefix = `${name}=`;
    const hit = this.document.cookie.split('; ').find((c) => c.startsWith(prefix));
    return hit ? decodeURIComponent(hit.slice(prefix.length)) : null;
  }
}
