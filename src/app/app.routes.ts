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
  { path: 'batches', title: 'Batch runs', canActivate: [signedIn], loadComponent: () => import('./batches/batches-page') },
  { path: 'batches/:id', title: 'Batch run', canActivate: [signedIn], loadComponent: () => import('./batches/batch-run-page') },
  { path: 'library', title: 'Set-up library', canActivate: [signedIn], loadComponent: () => import('./library/library-page') },
  { path: 'library/:id', title: 'Set-up', canActivate: [signedIn], loadComponent: () => import('./library/setup-detail-page') },
  { path: 'training', canActivate: [signedIn], loadChildren: () => import('./training/training.routes') },
  { path: 'team', title: 'Team', canActivate: [signedIn], loadComponent: () => import('./team/team-page') },
  { path: 'team/inventory', title: 'Block inventory', canActivate: [signedIn], loadComponent: () => import('./inventory/inventory-page') },
  { path: 'accept-invite', title: 'Join the team', loadComponent: () => import('./team/accept-invite-page') },
  { path: 'reset-password', title: 'Reset password', loadComponent: () => import('./team/reset-password-page') },
  { path: '**', title: 'Page not found', loadComponent: () => import('./not-found/not-found-page') },
];
