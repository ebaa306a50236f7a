import { DOCUMENT, inject, Injectable } from '@angular/core';

/** Full-page navigation out of the single-page app (e.g. to the server's SSO login). */
@Injectable({ providedIn: 'root' })
export class PageNavigator {
  private readonly document = inject(DOCUMENT);

  /** Loads `url` as a new page in this window. */
  assign(url: string): void {
    this.document.location.assign(url);
  }
}
