import { TestBed } from '@angular/core/testing';
import { Title } from '@angular/platform-browser';
import { TitleStrategy, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { PageTitle } from '../core/page-title';
import ComingPage from './coming-page';

describe('ComingPage', () => {
  let harness: RouterTestingHarness;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'sine-bar', title: 'Sine bar & plate', data: { heading: 'Sine bar & plate' }, component: ComingPage },
            { path: 'bare', component: ComingPage },
          ],
          withComponentInputBinding(),
        ),
        { provide: TitleStrategy, useClass: PageTitle },
      ],
    });
    harness = await RouterTestingHarness.create();
  });

  it('should name the area from route data and say it is being built', async () => {
    await harness.navigateByUrl('/sine-bar');
    expect(harness.routeNativeElement?.querySelector('h1')?.textContent).toBe('Sine bar & plate');
    expect(harness.routeNativeElement?.textContent).toContain('This area is being built');
    expect(harness.routeNativeElement?.querySelector('a')?.getAttribute('href')).toBe('/');
  });

  it('should title the browser tab after the route', async () => {
    await harness.navigateByUrl('/sine-bar');
    expect(TestBed.inject(Title).getTitle()).toBe('Sine bar & plate · Slantwise');
  });

  it('should fall back to a generic heading without route data', async () => {
    await harness.navigateByUrl('/bare');
    expect(harness.routeNativeElement?.querySelector('h1')?.textContent).toBe('Coming soon');
    expect(TestBed.inject(Title).getTitle()).toBe('Slantwise');
  });
});
