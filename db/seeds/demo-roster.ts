import type { PlayerInput } from '@shared/api/roster';

/**
 * The invented demo program's line room: 18 linemen and 3 tight ends. Names are made up for the demo;
 * any likeness to a real person is accidental.
 */
type Entry = Omit<PlayerInput, 'status' | 'redshirt'> & { redshirt?: boolean; status?: PlayerInput['status'] };

export const DEMO_TEAM_NAME = 'Ironvale Anvils';

export const DEMO_ROSTER: Entry[] = [
  { name: 'Tobin Hask', jersey: 72, positions: ['LT'], classYear: 'Sr', heightIn: 77, weightLb: 292 },
  { name: 'Marek Dunleavy', jersey: 66, positions: ['LG', 'C'], classYear: 'Jr', heightIn: 74, weightLb: 281 },
  { name: 'Quinn Ostrander', jersey: 55, positions: ['C'], classYear: 'Sr', heightIn: 73, weightLb: 270 },
  { name: 'Eli Brannock', jersey: 64, positions: ['RG'], classYear: 'Jr', heightIn: 75, weightLb: 288 },
  { name: 'Jasper Kettering', jersey: 78, positions: ['RT', 'LT'], classYear: 'Sr', heightIn: 78, weightLb: 301 },
  { name: 'Rowan Achterberg', jersey: 61, positions: ['LG', 'RG'], classYear: 'So', heightIn: 74, weightLb: 268, redshirt: true },
  { name: 'Silas Wendroth', jersey: 68, positions: ['RG', 'LG'], classYear: 'Jr', heightIn: 75, weightLb: 279 },
  { name: 'Cale Pembrook', jersey: 52, positions: ['C', 'LG'], classYear: 'So', heightIn: 72, weightLb: 262 },
  { name: 'Dorian Vasko', jersey: 74, positions: ['LT'], classYear: 'So', heightIn: 77, weightLb: 276 },
  { name: 'Hollis Trebane', jersey: 76, positions: ['RT'], classYear: 'Jr', heightIn: 77, weightLb: 294, status: 'injured' },
  { name: 'Bram Ellicott', jersey: 63, positions: ['LG'], classYear: 'Fr', heightIn: 73, weightLb: 255 },
  { name: 'Nico Farrowdale', jersey: 65, positions: ['RG', 'C'], classYear: 'Fr', heightIn: 73, weightLb: 258 },
  { name: 'Wes Harrowgate', jersey: 79, positions: ['RT', 'RG'], classYear: 'So', heightIn: 76, weightLb: 283 },
  { name: 'Arlo Mendevar', jersey: 57, positions: ['C'], classYear: 'Fr', heightIn: 72, weightLb: 250 },
  { name: 'Fenton Crale', jersey: 71, positions: ['LT', 'LG'], classYear: 'Jr', heightIn: 76, weightLb: 287 },
  { name: 'Gideon Oakhurst', jersey: 75, positions: ['RT'], classYear: 'Fr', heightIn: 77, weightLb: 266 },
  { name: 'Ira Balcombe', jersey: 60, positions: ['LG', 'RG', 'C'], classYear: 'Sr', heightIn: 74, weightLb: 284 },
  { name: 'Lennox Draymoor', jersey: 69, positions: ['RG'], classYear: 'So', heightIn: 74, weightLb: 271, status: 'inactive' },
  { name: 'Corwin Abernath', jersey: 88, positions: ['TE'], classYear: 'Sr', heightIn: 76, weightLb: 246 },
  { name: 'Tate Lindqvist', jersey: 85, positions: ['TE'], classYear: 'Jr', heightIn: 75, weightLb: 238 },
  { name: 'Reid Castellane', jersey: 81, positions: ['TE', 'RT'], classYear: 'So', heightIn: 77, weightLb: 252 },
];

export const DEMO_STAFF = [
  { email: 'admin@trenchwork.test', name: 'Harlan Voss', role: 'admin' },
  { email: 'coordinator@trenchwork.test', name: 'Mara Quillen', role: 'coordinator' },
  { email: 'coach@trenchwork.test', name: 'Dell Ashgrove', role: 'coach' },
  { email: 'coach2@trenchwork.test', name: 'Porter Nyland', role: 'coach' },
  { email: 'analyst@trenchwork.test', name: 'Juno Petrakis', role: 'analyst' },
] as const;

/** The demo player account signs in as the starting left guard. */
export const DEMO_PLAYER = { email: 'player@trenchwork.test', jersey: 66 } as const;

/** The demo depth chart by jersey: starters first, then the next men up (two guards compete at RG). */
export const DEMO_DEPTH_CHART: Record<string, number[]> = {
  LT: [72, 74, 71],
  LG: [66, 61, 63],
  C: [55, 52, 57],
  RG: [64, 68, 65],
  RT: [78, 79, 75],
  TE: [88, 85, 81],
};

/** Mid-season changes by jersey: from week 4 Silas Wendroth (#68) starts at RG, Eli Brannock (#64) behind him. */
export const DEMO_CHART_CHANGES: readonly { week: number; positions: Record<string, number[]>; reason: string }[] = [
  { week: 4, positions: { RG: [68, 64, 65] }, reason: 'Wendroth won the right guard battle in practice; Brannock rotates in' },
];

/** The right guard who starts the last demo weeks (he gets coaching points on the last game's film). */
export const DEMO_LATE_SEASON_RG = 68;
