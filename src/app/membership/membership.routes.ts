import { Routes } from '@angular/router';
import { PlaceholderPage } from '../shared/placeholder-page';

export const membershipRoutes: Routes = [
  { path: '', component: PlaceholderPage, data: { heading: 'Club dues', text: 'Joining and renewing club membership arrives here with the membership work (issue 4).' }, title: 'Club dues — Padside' },
];
