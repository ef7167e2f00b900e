// The demo sign-ins printed by `npm start`; they match src/db/seed/scenario.ts (a unit test checks).
export const DEMO_PASSWORD = 'servicing-demo';
export const DEMO_ACCOUNTS = [
  { role: 'owner', email: 'marnie@fenwright.example', name: 'Marnie Fenwright' },
  { role: 'office', email: 'priya@fenwright.example', name: 'Priya Castell' },
  { role: 'technician', email: 'tom@fenwright.example', name: 'Tom Arkwell' },
  { role: 'technician', email: 'jess@fenwright.example', name: 'Jess Brannock' },
];
