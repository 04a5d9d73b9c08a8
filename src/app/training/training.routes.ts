import { Routes } from '@angular/router';

/** The Training area: lessons, practice, assignments (own work; leads and admins also assign and score). */
export const TRAINING_ROUTES: Routes = [
  { path: '', title: 'Training', loadComponent: () => import('./training-home') },
  { path: 'practice', title: 'Practice', loadComponent: () => import('./practice-page') },
  { path: 'lessons/:slug', title: 'Lesson', loadComponent: () => import('./lesson-page') },
  { path: 'assignments', title: 'Assignments', loadComponent: () => import('./assignments-page') },
  { path: 'assignments/:id', title: 'Assignment', loadComponent: () => import('./assignment-work-page') },
  { path: 'assignments/:id/work/:userId', title: 'Apprentice work', loadComponent: () => import('./work-review-page') },
];
export default TRAINING_ROUTES;
