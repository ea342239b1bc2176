import type { Role } from './schema';

/**
 * The demo sign-ins (also in the README), in a file of their own so `npm start` can list them without
 * loading the seed and everything it imports.
 */
export const DEMO_ACCOUNTS: { email: string; password: string; displayName: string; role: Role }[] = [
  { email: 'admin@fernbrook.example', password: 'fernbrook-admin', displayName: 'Fernbrook Studio Admin', role: 'admin' },
  { email: 'designer@fernbrook.example', password: 'fernbrook-designer', displayName: 'Mira Fernbrook', role: 'designer' },
  { email: 'quilter@fernbrook.example', password: 'fernbrook-quilter', displayName: 'Jonah Pell', role: 'quilter' },
];
