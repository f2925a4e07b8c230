/**
 * The demo team of the invented Gannet Sound coastal district. Passwords are
 * for local demonstration only and are printed by `npm start`.
 */
export const demoUsers = [
  { email: 'admin@gannet-sound.test', displayName: 'Demo Admin', roles: ['admin'], password: 'tideline-admin-4821' },
  { email: 'analyst@gannet-sound.test', displayName: 'Demo Analyst', roles: ['analyst'], password: 'tideline-analyst-3907' },
  { email: 'auditor@gannet-sound.test', displayName: 'Demo Auditor', roles: ['auditor'], password: 'tideline-auditor-6154' },
  { email: 'approver@gannet-sound.test', displayName: 'Demo Approver', roles: ['approver'], password: 'tideline-approver-2286' },
] as const;

/** The demo account holding `role` (one per role). */
export function demoUser(role: string): (typeof demoUsers)[number] {
  const user = demoUsers.find((u) => (u.roles as readonly string[]).includes(role));
  if (!user) throw new Error(`no demo account holds the role ${role}`);
  return user;
}

export const demoNetworks = [
  {
    name: 'Gannet Sound buoy relay',
    file: 'gannet-sound-buoy-relay.csv',
    description: 'Four relay masts averaging wave readings, tuned for speed; six buoys listen downstream.',
  },
  {
    name: 'Marrow Fen microgrid',
    file: 'marrow-fen-microgrid.csv',
    description: 'Three inverters share droop set-points over directed radio links; feeders and stores follow.',
  },
  {
    name: 'Quarry Lane depots',
    file: 'quarry-lane-depots.csv',
    description: 'Seven depots balance stock over two-way links (an undirected network stored as both directions).',
  },
] as const;
