import { Injectable, inject } from '@angular/core';
import { Title } from '@angular/platform-browser';
import { RouterStateSnapshot, TitleStrategy } from '@angular/router';

/** The product name every tab title ends with. */
export const PRODUCT_NAME = 'Slantwise';

/** Sets the browser tab title to "<route title> · Slantwise". */
@Injectable({ providedIn: 'root' })
export class PageTitle extends TitleStrategy {
  private readonly title = inject(Title);

  /** Writes the title of the route just reached. */
  override updateTitle(snapshot: RouterStateSnapshot): void {
    const page = this.buildTitle(snapshot);
    this.title.setTitle(page ? `${page} · ${PRODUCT_NAME}` : PRODUCT_NAME);
  }
}
