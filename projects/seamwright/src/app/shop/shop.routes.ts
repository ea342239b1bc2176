import { Routes } from '@angular/router';
import { roleGuard } from '../core/auth.guard';
import { ShopShellComponent } from './shop-shell.component';

/** The pattern shop's screens, under /shop (signed in). */
export const shopRoutes: Routes = [
  {
    path: '',
    component: ShopShellComponent,
    children: [
      { path: '', pathMatch: 'full', loadComponent: () => import('./browse/shop-browse.component').then((m) => m.ShopBrowseComponent), title: 'Shop · Seamwright' },
      {
        path: 'patterns/:patternId',
        loadComponent: () => import('./listing/listing-detail.component').then((m) => m.ListingDetailComponent),
        title: 'Pattern in the shop · Seamwright',
      },
      { path: 'purchases', loadComponent: () => import('./purchases/purchases.component').then((m) => m.PurchasesComponent), title: 'Your purchases · Seamwright' },
      {
        path: 'sales',
        canActivate: [roleGuard('designer', 'admin')],
        loadComponent: () => import('./sales/sales.component').then((m) => m.SalesComponent),
        title: 'Sales · Seamwright',
      },
      {
        path: 'publish',
        canActivate: [roleGuard('designer', 'admin')],
        loadComponent: () => import('./publish/publish-settings.component').then((m) => m.PublishSettingsComponent),
        title: 'Publish in the shop · Seamwright',
      },
    ],
  },
];
