/** The demo sign-ins, printed at start and listed in the README. Seeded only in demo mode. */
export const DEMO_PASSWORD = 'redward-demo';

export const DEMO_ACCOUNTS = [
  { email: 'admin@demo.test', name: 'Ada Demo (admin)', isAdmin: true },
  { email: 'lead@demo.test', name: 'Lena Demo (lead)', isAdmin: false },
  { email: 'reader1@demo.test', name: 'Rafael Demo (reader 1)', isAdmin: false },
  { email: 'reader2@demo.test', name: 'Rosa Demo (reader 2)', isAdmin: false },
  { email: 'observer@demo.test', name: 'Otto Demo (observer)', isAdmin: false },
] as const;
