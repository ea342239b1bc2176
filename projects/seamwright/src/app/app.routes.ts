import { Routes } from '@angular/router';
import { authGuard, guestGuard, roleGuard } from './core/auth.guard';

export const routes: Routes = [
  { path: '', pathMatch: 'full', loadComponent: () => import('./home/home.component').then((m) => m.HomeComponent), title: 'Seamwright' },
  {
    path: 'sign-in',
    canActivate: [guestGuard],
    loadComponent: () => import('./auth/sign-in.component').then((m) => m.SignInComponent),
    title: 'Sign in · Seamwright',
  },
  {
    path: 'sign-up',
    canActivate: [guestGuard],
    loadComponent: () => import('./auth/sign-up.component').then((m) => m.SignUpComponent),
    title: 'Create an account · Seamwright',
  },
  {
    path: 'reset-password',
    loadComponent: () => import('./auth/reset-password-page.component').then((m) => m.ResetPasswordPageComponent),
    title: 'Reset your password · Seamwright',
  },
  {
    path: 'invitations/accept',
    loadComponent: () => import('./auth/accept-invitation.component').then((m) => m.AcceptInvitationComponent),
    title: 'Invitation · Seamwright',
  },
  {
    path: 'patterns',
    canActivate: [authGuard],
    loadComponent: () => import('./patterns/patterns-page.component').then((m) => m.PatternsPageComponent),
    title: 'Patterns · Seamwright',
  },
  {
    path: 'patterns/:patternId',
    canActivate: [authGuard],
    loadChildren: () => import('./pattern/pattern.routes').then((m) => m.patternRoutes),
  },
  {
    path: 'account/password',
    canActivate: [authGuard],
    loadComponent: () => import('./account/change-password.component').then((m) => m.ChangePasswordComponent),
    title: 'Change password · Seamwright',
  },
  { path: 'shop', canActivate: [authGuard], loadChildren: () => import('./shop/shop.routes').then((m) => m.shopRoutes) },
  {
    path: 'scale-check',
    loadComponent: () => import('./scale-check/scale-check.component').then((m) => m.ScaleCheckComponent),
    title: 'Scale check · Seamwright',
  },
  {
    path: 'admin',
    canActivate: [roleGuard('admin')],
    loadComponent: () => import('./admin/admin-users.component').then((m) => m.AdminUsersComponent),
    title: 'Admin · Seamwright',
  },
  {
    path: '**',
    loadComponent: () => import('./not-found/not-found.component').then((m) => m.NotFoundComponent),
    title: 'Not found · Seamwright',
  },
];
