import { Routes } from '@angular/router';

import { signedIn } from './core/auth-guards';

// One lazily loaded route per area. An area still being built shows the "coming" page; replace its
// loadComponent with the area's own page when it lands. Route `data.heading` names the area.
const coming = () => import('./coming/coming-page');

/** The app's routes. */
export const routes: Routes = [
  { path: '', title: 'Home', loadComponent: () => import('./home/home-page') },
  { path: 'sign-in', title: 'Sign in', loadComponent: () => import('./sign-in/sign-in-page') },
  { path: 'taper', title: 'Taper planner', data: { heading: 'Taper planner' }, loadComponent: () => import('./taper/taper-page') },
  { path: 'sine-bar', title: 'Sine bar & plate', data: { heading: 'Sine bar & plate' }, loadComponent: () => import('./sine-bar/sine-bar-page') },
  { path: 'gauge-blocks', title: 'Gauge blocks', data: { heading: 'Gauge blocks' }, loadComponent: () => import('./gauge-blocks/gauge-blocks-page') },
  { path: 'angle-blocks', title: 'Angle blocks', data: { heading: 'Angle blocks' }, loadComponent: () => import('./angle-blocks/angle-blocks-page') },
  { path: 'lathe-tapers', title: 'Lathe tapers', data: { heading: 'Lathe tapers' }, loadComponent: () => import('./lathe-tapers/lathe-tapers-page') },
  { path: 'pins-rolls', title: 'Pins & rolls', data: { heading: 'Pins & rolls' }, loadComponent: () => import('./pins-rolls/pins-rolls-page') },
  { path: 'batches', title: 'Batch runs', data: { heading: 'Batch runs' }, canActivate: [signedIn], loadComponent: coming },
  { path: 'library', title: 'Set-up library', data: { heading: 'Set-up library' }, canActivate: [signedIn], loadComponent: coming },
  { path: 'training', title: 'Training', data: { heading: 'Training' }, canActivate: [signedIn], loadComponent: coming },
  { path: 'team', title: 'Team', data: { heading: 'Team' }, canActivate: [signedIn], loadComponent: coming },
  { path: '**', title: 'Page not found', loadComponent: () => import('./not-found/not-found-page') },
];
