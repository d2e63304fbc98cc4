import { Routes } from '@angular/router';
import { PlaceholderPage } from '../shared/placeholder-page';

export const sponsorRoutes: Routes = [
  { path: '', component: PlaceholderPage, data: { heading: 'Sponsors', text: 'The sponsors page and portal arrive here with the build-log and sponsor work (issue 5).' }, title: 'Sponsors — Padside' },
];
